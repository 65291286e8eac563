namespace MpptArena.Environment;

/// <summary>
/// Builds a <see cref="PiecewiseLinearProfile"/> segment after segment: hold, ramp, step, points.
/// Generators (standard ramp sequences, cloud passages, measured series) append through it too.
/// </summary>
public sealed class ProfileBuilder
{
    private readonly List<double> _t = [];
    private readonly List<double> _v = [];

    /// <summary>Starts at time zero with <paramref name="initialValue"/>.</summary>
    public ProfileBuilder(double initialValue)
    {
        _t.Add(0.0);
        _v.Add(initialValue);
    }

    /// <summary>Time reached so far [s].</summary>
    public double TimeS => _t[^1];

    /// <summary>Breakpoints so far.</summary>
    public int Count => _t.Count;

    /// <summary>Value reached so far.</summary>
    public double Value => _v[^1];

    /// <summary>Keeps the value for <paramref name="durationS"/> [s].</summary>
    public ProfileBuilder Hold(double durationS) => LineTo(TimeS + durationS, Value);

    /// <summary>Jumps to <paramref name="value"/> at the current time.</summary>
    public ProfileBuilder Step(double value) => Add(TimeS, value);

    /// <summary>Straight line to <paramref name="value"/> over <paramref name="durationS"/> [s].</summary>
    public ProfileBuilder Ramp(double value, double durationS) => LineTo(TimeS + durationS, value);

    /// <summary>Straight line to <paramref name="value"/> at <paramref name="ratePerS"/> [unit/s] (sign ignored).</summary>
    public ProfileBuilder RampAtRate(double value, double ratePerS) => Ramp(value, Math.Abs(value - Value) / Math.Abs(ratePerS));

    /// <summary>Appends a point at an absolute time [s] (not before the current time).</summary>
    public ProfileBuilder LineTo(double timeS, double value) => Add(timeS, value);

    private ProfileBuilder Add(double timeS, double value)
    {
        if (timeS < TimeS) throw new ArgumentException($"time {timeS} s is before {TimeS} s");
        if (timeS == TimeS && value == Value) return this;
        _t.Add(timeS);
        _v.Add(value);
        return this;
    }

    /// <summary>The finished profile.</summary>
    public PiecewiseLinearProfile Build() => new(_t, _v);
}
