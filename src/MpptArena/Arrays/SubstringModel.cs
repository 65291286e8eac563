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
    /// <summary>Current [A] through the substring and its diode at substring voltage <paramref name="voltageV"/> [V].</summary>
    public double CurrentAtVoltage(double voltageV) =>
        SingleDiodeModel.CurrentAtVoltage(Cells, voltageV) + BypassCurrent(voltageV);

    /// <summary>Bypass diode current [A] at substring voltage [V] (forward when the substring is driven negative).</summary>
    public double BypassCurrent(double voltageV) =>
        BypassSaturationCurrentA * double.ExpM1(Math.Min(-voltageV / BypassIdealityVoltageV, 700.0));

    /// <summary>Substring voltage [V] at which it carries <paramref name="currentA"/> [A], and dV/dI [V/A] there.</summary>
    /// <remarks>
    /// Safeguarded Newton iteration in V on a bracket that always holds the root: for currents up to
    /// the cells' short-circuit current the voltage lies in [0, V_cells(I)] (the diode only leaks);
    /// beyond it in [-n Vt ln((I - Isc)/Is + 1), 0] (the diode carries at least the excess).
    /// </remarks>
    public double VoltageAtCurrent(double currentA, out double slopeVPerA)
    {
        double isc = SingleDiodeModel.CurrentAtVoltage(Cells, 0.0);
        double lo, hi, v;
        if (currentA <= isc)
        {
            lo = 0.0;
            hi = SingleDiodeModel.VoltageAtCurrent(Cells, currentA);
            v = hi;
        }
        else
        {
            lo = -BypassIdealityVoltageV * Math.Log((currentA - isc) / BypassSaturationCurrentA + 1.0);
            hi = 0.0;
            v = lo;
        }
        double slope = -1.0;
        for (int i = 0; i < 60; i++)
        {
            double ic = SingleDiodeModel.CurrentAtVoltage(Cells, v);
            double f = ic + BypassCurrent(v) - currentA;
            slope = SingleDiodeModel.SlopeAtPoint(Cells, v, ic)
                    - BypassSaturationCurrentA / BypassIdealityVoltageV * Math.Exp(Math.Min(-v / BypassIdealityVoltageV, 700.0));
            if (f > 0) lo = v; else hi = v;
            double next = v - f / slope;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - v) <= 1e-13 * (1.0 + Math.Abs(v)) || hi - lo <= 1e-14 * (1.0 + Math.Abs(v)))
            {
                v = next;
                break;
            }
            v = next;
        }
        slopeVPerA = 1.0 / slope;
        return v;
    }
}
