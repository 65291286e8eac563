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

    /// <summary>
    /// Relative current tolerance of the string tabulation: the cubic may miss the string's voltage sum by
    /// at most this fraction of the largest substring short-circuit current at any interval's midpoint.
    /// </summary>
    public const double RelativeCurrentTolerance = 1e-6;

    /// <summary>Voltage tolerance of each substring table [V].</summary>
    public const double SubstringVoltageToleranceV = 2e-5;

    /// <summary>
    /// Prepares <paramref name="exact"/> for fast evaluation. Strings are tabulated from 2 % above the largest
    /// substring short-circuit current down to minus five times it (about 7 % beyond open circuit);
    /// beyond that the curve is extended linearly.
    /// </summary>
    /// <param name="exact">The exact characteristic.</param>
    public PreparedArrayCurve(ExactArrayCurve exact)
    {
        Exact = exact;
        double iscMax = Math.Max(exact.Strings.Max(s => s.MaxShortCircuitCurrentA), 1e-3);
        double low = -5.0 * iscMax, high = 1.02 * iscMax + 1e-3;
        _strings = exact.Strings
            .Select(s => new PreparedStringCurve(s, low, high, RelativeCurrentTolerance * iscMax, SubstringVoltageToleranceV))
            .ToArray();
        _counts = exact.StringCounts.ToArray();
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

    /// <summary>Total interpolation nodes over all distinct strings.</summary>
    public int NodeCount => _strings.Sum(s => s.NodeCount);

    /// <inheritdoc/>
    public double CurrentAtVoltage(double voltageV) => CurrentAtVoltage(voltageV, out _);

    /// <summary>Array current [A] at voltage [V] and its slope dI/dV [A/V].</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV)
    {
        double sum = 0, slope = 0;
        for (int s = 0; s < _strings.Length; s++)
        {
            sum += _counts[s] * _strings[s].CurrentAtVoltage(voltageV, out double ds);
            slope += _counts[s] * ds;
        }
        slopeAPerV = slope;
        return sum;
    }
}
