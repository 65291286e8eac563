using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// Series substrings of one string at one instant, with identical substrings solved once, and an
/// optional blocking diode. All carry the string current; the string voltage is the sum of the
/// substring voltages less the blocking diode's drop (Kirchhoff's voltage law).
/// </summary>
public sealed class StringModel
{
    private readonly SubstringModel[] _distinct;
    private readonly int[] _count;
    private readonly double _blockingSaturationA;
    private readonly double _blockingIdealityV;
    private readonly double _maxShortCircuitA;

    /// <summary>A string from its distinct substrings and how many of each it holds.</summary>
    /// <param name="distinct">Distinct substring models.</param>
    /// <param name="count">How many substrings of each kind are in series [-].</param>
    /// <param name="blockingSaturationA">Blocking diode saturation current [A]; zero for no blocking diode.</param>
    /// <param name="blockingIdealityV">Blocking diode n Vt [V].</param>
    public StringModel(SubstringModel[] distinct, int[] count, double blockingSaturationA = 0, double blockingIdealityV = 0)
    {
        _distinct = distinct;
        _count = count;
        _blockingSaturationA = blockingSaturationA;
        _blockingIdealityV = blockingIdealityV;
        foreach (var s in distinct)
        {
            _maxShortCircuitA = Math.Max(_maxShortCircuitA, s.ShortCircuitCurrentA);
        }
    }

    /// <summary>Distinct substring models.</summary>
    public IReadOnlyList<SubstringModel> DistinctSubstrings => _distinct;

    /// <summary>How many of each distinct substring the string holds.</summary>
    public IReadOnlyList<int> Counts => _count;

    /// <summary>Largest short-circuit current of any substring [A].</summary>
    public double MaxShortCircuitCurrentA => _maxShortCircuitA;

    /// <summary>Blocking diode saturation current [A] and n Vt [V]; zeros when there is none.</summary>
    public (double SaturationCurrentA, double IdealityVoltageV) BlockingDiode => (_blockingSaturationA, _blockingIdealityV);

    /// <summary>True when a blocking diode is in series.</summary>
    public bool HasBlockingDiode => _blockingSaturationA > 0;

    /// <summary>String terminal voltage [V] at string current [A], and dV/dI [V/A].</summary>
    public double VoltageAtCurrent(double currentA, out double slopeVPerA)
    {
        double v = 0, dv = 0;
        for (int k = 0; k < _distinct.Length; k++)
        {
            v += _count[k] * _distinct[k].VoltageAtCurrent(currentA, out double s);
            dv += _count[k] * s;
        }
        if (HasBlockingDiode)
        {
            double x = currentA / _blockingSaturationA + 1.0;
            if (x <= 0)
            {
                slopeVPerA = double.NegativeInfinity;
                return double.PositiveInfinity;
            }
            v -= _blockingIdealityV * PortableMath.Log(x);
            dv -= _blockingIdealityV / (currentA + _blockingSaturationA);
        }
        slopeVPerA = dv;
        return v;
    }

    /// <summary>String current [A] at string terminal voltage [V], by safeguarded Newton iteration in I.</summary>
    public double CurrentAtVoltage(double voltageV)
    {
        double hi = _maxShortCircuitA * 1.05 + 1e-3;
        double step = Math.Max(_maxShortCircuitA, 1e-3);
        while (VoltageAtCurrent(hi, out _) > voltageV) { hi += step; step *= 2; }
        double lo = 0.0;
        if (VoltageAtCurrent(lo, out _) < voltageV)
        {
            if (HasBlockingDiode)
            {
                double fraction = 0.5;
                lo = -_blockingSaturationA * fraction;
                while (VoltageAtCurrent(lo, out _) < voltageV && fraction < 1.0 - 1e-15) { fraction = 0.5 * (1.0 + fraction); lo = -_blockingSaturationA * fraction; }
                if (VoltageAtCurrent(lo, out _) < voltageV) return lo;
            }
            else
            {
                double d = Math.Max(_maxShortCircuitA * 0.05, 1e-3);
                lo = -d;
                while (VoltageAtCurrent(lo, out _) < voltageV) { d *= 2; lo = -d; }
            }
        }
        // V(I) decreases with I: the root lies in [lo, hi].
        var mismatch = new VoltageMismatch(this, voltageV);
        return SafeguardedNewton.FindRoot(ref mismatch, lo, hi, 0.5 * (lo + hi), 1e-13 * (1.0 + hi - lo), out _);
    }

    /// <summary>String current [A] at string terminal voltage [V], and dI/dV [A/V] there (the inverse of the series dV/dI).</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV)
    {
        double i = CurrentAtVoltage(voltageV);
        VoltageAtCurrent(i, out double dvdi);
        slopeAPerV = 1.0 / dvdi;
        return i;
    }

    private readonly struct VoltageMismatch(StringModel s, double voltageV) : IFunctionWithSlope
    {
        public double Evaluate(double currentA, out double slope) => s.VoltageAtCurrent(currentA, out slope) - voltageV;
    }
}
