using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// The array characteristic prepared once for one set of conditions so that each later evaluation is
/// an interpolation, not a nested solve: every distinct string is tabulated
/// (<see cref="PreparedStringCurve"/>) and the array current is the sum over parallel strings.
/// </summary>
public sealed class PreparedArrayCurve : IArrayCurve
{
    private readonly PreparedStringCurve[] _strings;
    private readonly int[] _counts;
    private readonly PiecewiseCubic _array;

    /// <summary>Voltage tolerance of each substring table [V].</summary>
    public const double SubstringVoltageToleranceV = 5e-5;

    /// <summary>
    /// Prepares <paramref name="exact"/> for fast evaluation. Strings are tabulated from 2 % above the largest
    /// substring short-circuit current down to minus five times it (about 7 % beyond open circuit);
    /// beyond that the curve is extended linearly.
    /// </summary>
    /// <param name="exact">The exact characteristic.</param>
    /// <param name="tables">Cache of substring tables shared across preparations, or null.</param>
    /// <param name="strings">Cache of string curves shared across preparations, or null.</param>
    public PreparedArrayCurve(ExactArrayCurve exact, SubstringTableCache? tables = null, StringCurveCache? strings = null)
    {
        Exact = exact;
        double iscMax = Math.Max(exact.Strings.Max(s => s.MaxShortCircuitCurrentA), 1e-3);
        double low = -5.0 * iscMax, high = 1.02 * iscMax + 1e-3;
        _strings = exact.Strings
            .Select(s => strings is null
                ? new PreparedStringCurve(s, low, high, SubstringVoltageToleranceV, tables)
                : strings.Get(s, low, high, SubstringVoltageToleranceV, tables))
            .ToArray();
        _counts = exact.StringCounts.ToArray();
        _array = _strings.Length == 1 ? _strings[0].ToCubic(_counts[0]) : Combine(_strings, _counts);
        OpenCircuitVoltageV = FindOpenCircuitVoltage();
    }

    private double FindOpenCircuitVoltage()
    {
        double lo = _strings.Min(s => s.OpenCircuitVoltageV), hi = _strings.Max(s => s.OpenCircuitVoltageV);
        if (hi <= 0) return 0;
        if (hi - lo < 1e-12) return hi;
        for (int k = 0; k < 100 && hi - lo > 1e-12 * hi; k++)
        {
            double mid = 0.5 * (lo + hi);
            if (CurrentAtVoltage(mid) > 0) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>The exact characteristic this was prepared from.</summary>
    public ExactArrayCurve Exact { get; }

    /// <inheritdoc/>
    public double OpenCircuitVoltageV { get; }

    /// <summary>Interpolation nodes of the combined array curve.</summary>
    public int NodeCount => _array.NodeCount;

    /// <inheritdoc/>
    public double CurrentAtVoltage(double voltageV) => _array.Evaluate(voltageV, out _);

    /// <summary>Every maximum and minimum of the power P(V) = V I(V) on [<paramref name="fromV"/>, <paramref name="toV"/>], exactly as the prepared curve has them (<see cref="PiecewiseCubic.CriticalPointsOfXTimes"/>).</summary>
    public List<(double X, bool IsMaximum)> PowerCriticalPoints(double fromV, double toV) => _array.CriticalPointsOfXTimes(fromV, toV);

    /// <summary>Array current [A] at voltage [V] and its slope dI/dV [A/V].</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV) => _array.Evaluate(voltageV, out slopeAPerV);

    /// <summary>
    /// The array characteristic as one piecewise cubic: on every interval between neighbouring string
    /// nodes each string is a single cubic, so their weighted sum is a cubic too, fixed exactly by its
    /// values and slopes at the two ends. One look-up then serves all strings.
    /// </summary>
    private static PiecewiseCubic Combine(PreparedStringCurve[] strings, int[] counts)
    {
        // Work arrays from the shared pool: the cubic keeps its own copies.
        var pool = System.Buffers.ArrayPool<double>.Shared;
        int capacity = strings.Sum(s => s.NodeCount);
        double[] merged = pool.Rent(capacity), scratch = pool.Rent(capacity), y = pool.Rent(capacity), m = pool.Rent(capacity);
        int n = strings[0].NodeVoltagesV.Length;
        strings[0].NodeVoltagesV.CopyTo(merged);
        for (int s = 1; s < strings.Length; s++)
        {
            n = MergeNodes(merged.AsSpan(0, n), strings[s].NodeVoltagesV, scratch);
            (merged, scratch) = (scratch, merged);
        }
        var x = merged.AsSpan(0, n);
        y.AsSpan(0, n).Clear();
        m.AsSpan(0, n).Clear();
        for (int s = 0; s < strings.Length; s++)
        {
            int interval = 0;
            for (int k = 0; k < n; k++)
            {
                y[k] += counts[s] * strings[s].CurrentAtRisingVoltage(x[k], ref interval, out double slope);
                m[k] += counts[s] * slope;
            }
        }
        var cubic = new PiecewiseCubic(x, y.AsSpan(0, n), m.AsSpan(0, n));
        pool.Return(merged);
        pool.Return(scratch);
        pool.Return(y);
        pool.Return(m);
        return cubic;
    }

    /// <summary>Two ascending node lists merged into <paramref name="into"/>, dropping a node within 1e-12 (relative) of the one before; returns the count.</summary>
    private static int MergeNodes(ReadOnlySpan<double> a, ReadOnlySpan<double> b, Span<double> into)
    {
        int i = 0, j = 0, n = 0;
        while (i < a.Length || j < b.Length)
        {
            double v = j >= b.Length || (i < a.Length && a[i] <= b[j]) ? a[i++] : b[j++];
            if (n == 0 || v > into[n - 1] + 1e-12 * Math.Max(1.0, Math.Abs(v))) into[n++] = v;
        }
        return n;
    }
}
