namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Incremental conductance with a step proportional to |dP/dV|: large far from the MPP, small near it.
/// </summary>
/// <remarks>
/// F. Liu, S. Duan, F. Liu, B. Liu, Y. Kang, "A variable step size INC MPPT method for PV systems",
/// IEEE Trans. Industrial Electronics 55(7), 2008, 2622-2628: step = N |dP/dV|, limited to a maximum
/// (their eq. 9 and the rule for choosing N).
/// </remarks>
public sealed class VariableStepIncrementalConductance : IMpptTracker
{
    private readonly double _scale, _maxStepV, _minStepV, _tolerance, _startFraction;
    private TrackerContext _context = null!;
    private double _previousV, _previousI, _reference;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("scale_v2_per_w", "V^2/W", 0.5, 0.0, 1e3, "N: step = N |dP/dV|"),
        new("max_step_v", "V", 5.0, 1e-3, 1e4, "Largest step of the voltage reference"),
        new("min_step_v", "V", 0.2, 0.0, 1e4, "Smallest step of the voltage reference"),
        new("tolerance", "-", 0.01, 0.0, 1.0, "Relative band on dI/dV + I/V inside which the reference is held"),
        new("start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <summary>A tracker from settings.</summary>
    public VariableStepIncrementalConductance(TrackerSettings s)
    {
        _scale = s["scale_v2_per_w"];
        _maxStepV = s["max_step_v"];
        _minStepV = s["min_step_v"];
        _tolerance = s["tolerance"];
        _startFraction = s["start_fraction"];
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _context = context;
        _previousV = 0;
        _previousI = 0;
        _reference = Math.Clamp(_startFraction * context.NominalOpenCircuitVoltageV, context.MinCommand, context.MaxCommand);
        return _reference;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        double dv = m.VoltageV - _previousV, di = m.CurrentA - _previousI;
        int move = IncrementalConductance.Direction(m.VoltageV, m.CurrentA, dv, di, _tolerance, _context.VoltageLsbV, _context.CurrentLsbA);
        double dp = m.VoltageV * m.CurrentA - _previousV * _previousI;
        double step = Math.Abs(dv) > 0.5 * _context.VoltageLsbV ? _scale * Math.Abs(dp / dv) : _maxStepV;
        step = Math.Clamp(step, _minStepV, _maxStepV);
        _previousV = m.VoltageV;
        _previousI = m.CurrentA;
        _reference = Math.Clamp(_reference + move * step, _context.MinCommand, _context.MaxCommand);
        return _reference;
    }
}
