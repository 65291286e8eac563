using MpptArena.Numerics;
using MpptArena.Pv;

namespace MpptArena.Arrays;

/// <summary>
/// One substring of series cells at one operating condition with its antiparallel bypass diode:
/// I(V) = I_cells(V) + Is [exp(-V/(n Vt)) - 1]. The sum of two decreasing functions of V, so each
/// current has exactly one voltage.
/// </summary>
/// <param name="Cells">Single-diode parameters of the substring's cells.</param>
/// <param name="BypassSaturationCurrentA">Bypass diode saturation current [A].</param>
/// <param name="BypassIdealityVoltageV">Bypass diode n Vt [V].</param>
public readonly record struct SubstringModel(
    SingleDiodeParameters Cells,
    double BypassSaturationCurrentA,
    double BypassIdealityVoltageV)
{
    /// <summary>Short-circuit current of the cells [A] (the current at which the bypass diode takes over).</summary>
    public double ShortCircuitCurrentA { get; } = SingleDiodeModel.CurrentAtVoltage(Cells, 0.0);

    /// <summary>Current [A] through the substring and its diode at substring voltage <paramref name="voltageV"/> [V].</summary>
    public double CurrentAtVoltage(double voltageV) =>
        SingleDiodeModel.CurrentAtVoltage(Cells, voltageV) + BypassCurrent(voltageV);

    /// <summary>Bypass diode current [A] at substring voltage [V] (forward when the substring is driven negative).</summary>
    public double BypassCurrent(double voltageV) =>
        BypassSaturationCurrentA * PortableMath.ExpM1(Math.Min(-voltageV / BypassIdealityVoltageV, 700.0));

    /// <summary>Substring voltage [V] at which it carries <paramref name="currentA"/> [A], and dV/dI [V/A] there.</summary>
    /// <remarks>
    /// Safeguarded Newton iteration in V on a bracket that always holds the root: for currents up to
    /// the cells' short-circuit current the voltage lies in [0, V_cells(I)] (the diode only leaks);
    /// beyond it in [-n Vt ln((I - Isc)/Is + 1), 0] (the diode carries at least the excess).
    /// </remarks>
    public double VoltageAtCurrent(double currentA, out double slopeVPerA)
    {
        double isc = ShortCircuitCurrentA;
        double lo, hi, v;
        if (currentA <= isc)
        {
            lo = 0.0;
            hi = SingleDiodeModel.VoltageAtCurrent(Cells, currentA);
            v = hi;
        }
        else
        {
            // Widened by a hundredth of n Vt: at the bound itself f is zero up to rounding, and a rounding
            // of the wrong sign would leave the bracket without a sign change (seen for dark substrings).
            lo = -BypassIdealityVoltageV * (PortableMath.Log((currentA - isc) / BypassSaturationCurrentA + 1.0) + 0.01);
            hi = 0.0;
            v = lo;
        }
        var f = new CurrentMismatch(this, currentA);
        v = SafeguardedNewton.FindRoot(ref f, lo, hi, v, 1e-12 * (1.0 + Math.Abs(hi - lo)), out double slope);
        slopeVPerA = 1.0 / slope;
        return v;
    }

    /// <summary>Current [A] and dI/dV [A/V] at substring voltage [V], sharing one exponential between the bypass current and its slope.</summary>
    public double CurrentAndSlopeAtVoltage(double voltageV, out double slopeAPerV)
    {
        double ic = SingleDiodeModel.CurrentAtVoltage(Cells, voltageV);
        double e = PortableMath.Exp(Math.Min(-voltageV / BypassIdealityVoltageV, 700.0));
        slopeAPerV = SingleDiodeModel.SlopeAtPoint(Cells, voltageV, ic) - BypassSaturationCurrentA / BypassIdealityVoltageV * e;
        return ic + BypassSaturationCurrentA * (e - 1.0);
    }

    /// <summary>Slope of the substring's total current with voltage, dI/dV [A/V], at voltage [V].</summary>
    public double SlopeAtVoltage(double voltageV, double cellCurrentA) =>
        SingleDiodeModel.SlopeAtPoint(Cells, voltageV, cellCurrentA)
        - BypassSaturationCurrentA / BypassIdealityVoltageV * PortableMath.Exp(Math.Min(-voltageV / BypassIdealityVoltageV, 700.0));

    private readonly struct CurrentMismatch(SubstringModel s, double currentA) : IFunctionWithSlope
    {
        public double Evaluate(double voltageV, out double slope)
        {
            double ic = SingleDiodeModel.CurrentAtVoltage(s.Cells, voltageV);
            slope = s.SlopeAtVoltage(voltageV, ic);
            return ic + s.BypassCurrent(voltageV) - currentA;
        }
    }
}
