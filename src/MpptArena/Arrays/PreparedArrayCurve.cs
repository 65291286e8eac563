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
    /// Relative current tolerance of the tabulation: the cubic may miss the exact curve by at most this
    /// fraction of the largest substring short-circuit current at any interval's midpoint. 1e-6 keeps the
    /// power error far below the 1e-4 of MPP power that scoring needs.
    /// </summary>
    public const double RelativeCurrentTolerance = 1e-6;

    /// <summary>Prepares <paramref name="exact"/> for fast evaluation from slightly below 0 V to 1.1 Voc; beyond, linear extrapolation.</summary>
    /// <param name="exact">The exact characteristic.</param>
    public PreparedArrayCurve(ExactArrayCurve exact)
    {
        Exact = exact;
        OpenCircuitVoltageV = exact.OpenCircuitVoltageV;
        double vMax = Math.Max(1.1 * exact.OpenCircuitVoltageV, 1.0);
        double vMin = -0.05 * vMax;
        _strings = exact.Strings
            .Select(s => new PreparedStringCurve(s, vMin, vMax, RelativeCurrentTolerance * Math.Max(s.MaxShortCircuitCurrentA, 1e-3)))
            .ToArray();
        _counts = exact.StringCounts.ToArray();
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
