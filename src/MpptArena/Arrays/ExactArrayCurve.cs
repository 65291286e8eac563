namespace MpptArena.Arrays;

/// <summary>
/// The array characteristic solved exactly at every call: for each string, the current at which the
/// series sum of substring voltages equals the terminal voltage; the array current is the sum over
/// parallel strings (Kirchhoff's current law). Identical strings are solved once.
/// </summary>
public sealed class ExactArrayCurve : IArrayCurve
{
    private readonly StringModel[] _strings;
    private readonly int[] _stringCount;

    /// <summary>A curve from distinct strings and how many of each are in parallel.</summary>
    /// <param name="strings">Distinct strings.</param>
    /// <param name="stringCount">How many of each are in parallel [-].</param>
    public ExactArrayCurve(StringModel[] strings, int[] stringCount)
    {
        _strings = strings;
        _stringCount = stringCount;
        _openCircuitVoltageV = new Lazy<double>(FindOpenCircuitVoltage);
    }

    private readonly Lazy<double> _openCircuitVoltageV;

    /// <summary>Distinct strings.</summary>
    public IReadOnlyList<StringModel> Strings => _strings;

    /// <summary>How many of each distinct string are in parallel.</summary>
    public IReadOnlyList<int> StringCounts => _stringCount;

    /// <inheritdoc/>
    public double OpenCircuitVoltageV => _openCircuitVoltageV.Value;

    /// <inheritdoc/>
    public double CurrentAtVoltage(double voltageV)
    {
        double sum = 0;
        for (int s = 0; s < _strings.Length; s++) sum += _stringCount[s] * _strings[s].CurrentAtVoltage(voltageV);
        return sum;
    }

    /// <summary>Array current [A] at voltage [V] and dI/dV [A/V]: Kirchhoff's current law over the strings, each slope the inverse of its series dV/dI.</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV)
    {
        double sum = 0, slope = 0;
        for (int s = 0; s < _strings.Length; s++)
        {
            sum += _stringCount[s] * _strings[s].CurrentAtVoltage(voltageV, out double ds);
            slope += _stringCount[s] * ds;
        }
        slopeAPerV = slope;
        return sum;
    }

    /// <summary>Array short-circuit current [A].</summary>
    public double ShortCircuitCurrentA => CurrentAtVoltage(0.0);

    private double FindOpenCircuitVoltage()
    {
        // Strings in parallel: the array is at open circuit where the summed current is zero (Kirchhoff's
        // current law). Bracket between the lowest and highest string open-circuit voltage; the root is found
        // to a tolerance on voltage alone: a blocked string leaks only about 1e-11 A, so a tolerance on the
        // current would accept the higher string's own open-circuit voltage.
        double lo = double.PositiveInfinity, hi = 0;
        foreach (var s in _strings)
        {
            double v = s.VoltageAtCurrent(0.0, out _);
            lo = Math.Min(lo, v);
            hi = Math.Max(hi, v);
        }
        if (hi <= 0) return 0;
        if (_strings.Length == 1 || hi - lo < 1e-12) return hi;
        // Newton in the bracket with the closed-form slope, stopping on the step in volts alone.
        var current = new ArrayCurrent(this);
        return Numerics.SafeguardedNewton.FindRoot(ref current, lo, hi, hi, 1e-12 * hi, out _);
    }

    private readonly struct ArrayCurrent(ExactArrayCurve curve) : Numerics.IFunctionWithSlope
    {
        public double Evaluate(double voltageV, out double slope) => curve.CurrentAtVoltage(voltageV, out slope);
    }
}
