namespace MpptArena.Environment;

/// <summary>
/// A quantity that changes with time as straight lines between breakpoints. Two breakpoints at one
/// time make a step. Before the first point and after the last the value is held.
/// </summary>
public sealed class PiecewiseLinearProfile
{
    private readonly double[] _timeS;
    private readonly double[] _value;

    /// <summary>A profile through the given breakpoints; times must not decrease.</summary>
    /// <param name="timeS">Breakpoint times [s], non-decreasing.</param>
    /// <param name="value">Values at the breakpoints [unit of the quantity].</param>
    public PiecewiseLinearProfile(IReadOnlyList<double> timeS, IReadOnlyList<double> value)
    {
        if (timeS.Count == 0 || timeS.Count != value.Count) throw new ArgumentException("a profile needs one or more (time, value) pairs");
        for (int i = 1; i < timeS.Count; i++)
        {
            if (timeS[i] < timeS[i - 1]) throw new ArgumentException($"profile time goes backwards at point {i}");
        }
        _timeS = timeS.ToArray();
        _value = value.ToArray();
    }

    /// <summary>A constant profile.</summary>
    /// <param name="value">The value.</param>
    public static PiecewiseLinearProfile Constant(double value) => new([0.0], [value]);

    /// <summary>Breakpoint times [s].</summary>
    public IReadOnlyList<double> TimesS => _timeS;

    /// <summary>Breakpoint values.</summary>
    public IReadOnlyList<double> Values => _value;

    /// <summary>Time of the last breakpoint [s].</summary>
    public double EndTimeS => _timeS[^1];

    /// <summary>Value at time <paramref name="timeS"/> [s]; at a step the later value.</summary>
    public double ValueAt(double timeS)
    {
        int noHint = -1; // searches the whole profile
        return ValueAt(timeS, ref noHint);
    }

    /// <summary>
    /// As <see cref="ValueAt(double)"/>, starting from the segment a caller that steps forward in time read
    /// last (<paramref name="segment"/>, updated; any value is safe, a wrong one only costs a search).
    /// </summary>
    public double ValueAt(double timeS, ref int segment)
    {
        var times = _timeS;
        if (timeS < times[0]) return _value[0];
        if (timeS >= times[^1]) return _value[^1];
        int j = segment;
        // The segment holds timeS when times[j] <= timeS < times[j + 1]: the last breakpoint at or before
        // timeS, so at a step the later value. Exactly one such j exists.
        if ((uint)j >= (uint)(times.Length - 1) || times[j] > timeS) j = FirstAfter(times, timeS) - 1;
        else
        {
            int walked = 0;
            while (timeS >= times[j + 1] && ++walked <= 4) j++;
            if (timeS >= times[j + 1]) j = FirstAfter(times, timeS) - 1;
        }
        segment = j;
        double t0 = times[j], t1 = times[j + 1];
        return _value[j] + (_value[j + 1] - _value[j]) * (timeS - t0) / (t1 - t0);
    }

    /// <summary>True if a breakpoint (a step or a change of slope) lies in [from, to) [s]. Allocation-free.</summary>
    public bool HasBreakpointIn(double fromS, double toS)
    {
        int noHint = -1; // searches the whole profile
        return HasBreakpointIn(fromS, toS, ref noHint);
    }

    /// <summary>
    /// As <see cref="HasBreakpointIn(double, double)"/> for a caller whose intervals move forward:
    /// <paramref name="next"/> holds the index of the first breakpoint at or after the last interval's start
    /// (updated; any value is safe, a wrong one only costs a search).
    /// </summary>
    public bool HasBreakpointIn(double fromS, double toS, ref int next)
    {
        var times = _timeS;
        int j = next;
        if ((uint)j > (uint)times.Length || (j > 0 && times[j - 1] >= fromS)) j = FirstAtOrAfter(times, fromS);
        else while (j < times.Length && times[j] < fromS) j++;
        next = j;
        return j < times.Length && times[j] < toS;
    }

    /// <summary>Index of the first time greater than <paramref name="t"/> (the length if none); times sorted ascending.</summary>
    private static int FirstAfter(double[] times, double t)
    {
        int lo = 0, hi = times.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (times[mid] <= t) lo = mid + 1;
            else hi = mid;
        }
        return lo;
    }

    /// <summary>Index of the first time not less than <paramref name="t"/> (the length if none); times sorted ascending.</summary>
    private static int FirstAtOrAfter(double[] times, double t)
    {
        int lo = 0, hi = times.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (times[mid] < t) lo = mid + 1;
            else hi = mid;
        }
        return lo;
    }
}
