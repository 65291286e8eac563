namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Incremental conductance with a step proportional to |dP/dV|: large far from the MPP, small near it.
/// </summary>
/// <remarks>
/// F. Liu, S. Duan, F. Liu, B. Liu, Y. Kang, "A variable step size INC MPPT method for PV systems",
/// IEEE Trans. Industrial Electronics 55(7), 2008, 2622-2628: step = N |dP/dV|, limited to a maximum
/// (their eq. 9 and the rule for choosing N).
/// </remarks>
public sealed class VariableStepIncrementalConductance(TrackerSettings s) : IncrementalConductanceCore(s["tolerance"], s["start_fraction"])
{
    private readonly double _scale = s["scale_v2_per_w"], _maxStepV = s["max_step_v"], _minStepV = s["min_step_v"];

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("scale_v2_per_w", "V^2/W", 0.5, 0.0, 1e3, "N: step = N |dP/dV|"),
        new("max_step_v", "V", 5.0, 1e-3, 1e4, "Largest step of the voltage reference"),
        new("min_step_v", "V", 0.2, 0.0, 1e4, "Smallest step of the voltage reference"),
        new("tolerance", "-", 0.01, 0.0, 1.0, "Relative band on dI/dV + I/V inside which the reference is held"),
        new("start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <inheritdoc/>
    protected override double StepSizeV(double deltaVoltageV, double deltaPowerW)
    {
        double step = Math.Abs(deltaVoltageV) > 0.5 * Context.VoltageLsbV ? _scale * Math.Abs(deltaPowerW / deltaVoltageV) : _maxStepV;
        return Math.Clamp(step, _minStepV, _maxStepV);
    }
}
