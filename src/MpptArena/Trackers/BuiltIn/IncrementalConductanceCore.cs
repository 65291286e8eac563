namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// What the incremental-conductance trackers share: the voltage-reference state, the previous sample,
/// and the direction rule (Hussein, Muta, Hoshino, Osakada, IEE Proc. GTD 142(1), 1995). Subclasses only
/// choose the step size.
/// </summary>
public abstract class IncrementalConductanceCore : IMpptTracker
{
    private readonly double _tolerance, _startFraction;
    private TrackerContext _context = null!;
    private double _previousV, _previousI, _reference;

    /// <summary>A core with the relative tolerance and the start fraction.</summary>
    protected IncrementalConductanceCore(double tolerance, double startFraction)
    {
        _tolerance = tolerance;
        _startFraction = startFraction;
    }

    /// <summary>The hardware, for step-size rules that need the ADC resolution.</summary>
    protected TrackerContext Context => _context;

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
        double step = StepSizeV(dv, m.VoltageV * m.CurrentA - _previousV * _previousI);
        _previousV = m.VoltageV;
        _previousI = m.CurrentA;
        _reference = Math.Clamp(_reference + move * step, _context.MinCommand, _context.MaxCommand);
        return _reference;
    }

    /// <summary>Step of the voltage reference [V] given this sample's voltage change [V] and power change [W].</summary>
    protected abstract double StepSizeV(double deltaVoltageV, double deltaPowerW);

    /// <summary>+1 to raise the voltage, -1 to lower it, 0 to hold.</summary>
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
