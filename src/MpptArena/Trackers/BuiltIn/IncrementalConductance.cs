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
public sealed class IncrementalConductance : IMpptTracker
{
    private readonly double _stepV;
    private readonly double _tolerance;
    private readonly double _startFraction;
    private TrackerContext _context = null!;
    private double _previousV, _previousI, _reference;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("step_v", "V", 2.0, 1e-3, 1e4, "Change of the voltage reference per sample"),
        new("tolerance", "-", 0.02, 0.0, 1.0, "Relative band on dI/dV + I/V inside which the reference is held"),
        new("start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <summary>A tracker from settings.</summary>
    public IncrementalConductance(TrackerSettings s)
    {
        _stepV = s["step_v"];
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
        int move = Direction(m.VoltageV, m.CurrentA, dv, di, _tolerance, _context.VoltageLsbV, _context.CurrentLsbA);
        _previousV = m.VoltageV;
        _previousI = m.CurrentA;
        _reference = Math.Clamp(_reference + move * _stepV, _context.MinCommand, _context.MaxCommand);
        return _reference;
    }

    /// <summary>+1 to raise the voltage, -1 to lower it, 0 to hold; shared with the variable-step variant.</summary>
    internal static int Direction(double v, double i, double dv, double di, double tolerance, double lsbV, double lsbA)
    {
        if (v <= lsbV) return 1;
        if (Math.Abs(dv) < 0.5 * lsbV)
        {
            // No voltage change: only irradiance moved the current (Hussein et al. 1995, fig. 3).
            if (Math.Abs(di) < 0.5 * lsbA) return 0;
            return di > 0 ? 1 : -1;
        }
        double g = i / v;
        double sum = di / dv + g;
        if (Math.Abs(sum) <= tolerance * Math.Abs(g)) return 0;
        return sum > 0 ? 1 : -1;
    }
}
