namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Incremental conductance: at the MPP dI/dV = -I/V. Step the voltage reference up while
/// dI/dV + I/V &gt; 0, down while it is below zero, and hold while it is within a tolerance.
/// </summary>
/// <remarks>
/// K. H. Hussein, I. Muta, T. Hoshino, M. Osakada, "Maximum photovoltaic power tracking: an algorithm
/// for rapidly changing atmospheric conditions", IEE Proc. Generation, Transmission and Distribution
/// 142(1), 1995, 59-64. The tolerance here is relative: |dI/dV + I/V| &lt; tolerance * I/V.
/// </remarks>
public sealed class IncrementalConductance(TrackerSettings s) : IncrementalConductanceCore(s["tolerance"], s["start_fraction"])
{
    private readonly double _stepV = s["step_v"];

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("step_v", "V", 2.0, 1e-3, 1e4, "Change of the voltage reference per sample"),
        new("tolerance", "-", 0.02, 0.0, 1.0, "Relative band on dI/dV + I/V inside which the reference is held"),
        new("start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <inheritdoc/>
    protected override double StepSizeV(double deltaVoltageV, double deltaPowerW) => _stepV;
}
