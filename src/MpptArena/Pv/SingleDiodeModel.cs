using MpptArena.Numerics;

namespace MpptArena.Pv;

/// <summary>
/// Explicit solutions of the single-diode equation through the Lambert W function, written so that
/// no intermediate overflows: every voltage from deep reverse bias to beyond open circuit, every
/// irradiance including darkness.
/// </summary>
/// <remarks>
/// A. Jain, A. Kapoor, "Exact analytical solutions of the parameters of real solar cells using
/// Lambert W-function", Solar Energy Materials and Solar Cells 81 (2004) 269-277, eqs. 4-5.
/// W(theta) is evaluated as the Wright omega function of ln(theta) (Lawrence, Corless, Jeffrey,
/// ACM TOMS 38(3), 2012). Where W is large the identity ln W = ln theta - W turns the difference of
/// two large terms into a logarithm, which removes the cancellation near and above open circuit.
/// </remarks>
public static class SingleDiodeModel
{
    /// <summary>Terminal current at a terminal voltage.</summary>
    /// <param name="p">Model parameters.</param>
    /// <param name="voltageV">Terminal voltage [V].</param>
    /// <returns>Terminal current [A], positive when generating.</returns>
    public static double CurrentAtVoltage(in SingleDiodeParameters p, double voltageV)
    {
        double il = p.PhotocurrentA, i0 = p.SaturationCurrentA, a = p.ModifiedIdealityV;
        double rs = p.SeriesResistanceOhm, gsh = p.ShuntConductanceS;
        if (rs <= 0.0)
        {
            return il - i0 * PortableMath.ExpM1(voltageV / a) - voltageV * gsh;
        }
        // Jain & Kapoor (2004) eq. 5 divided through by Rsh so that Gsh = 0 is allowed.
        double k = 1.0 + rs * gsh;
        double lnM = PortableMath.Log(rs * i0 / (a * k));
        double z = lnM + (rs * (il + i0) + voltageV) / (a * k);
        double w = LambertW.WrightOmega(z);
        if (z > 1.0)
        {
            // a (z - W)/Rs = a ln(W)/Rs ... rearranged: I = (a (ln W - ln M) - V) / Rs.
            return (a * (PortableMath.Log(w) - lnM) - voltageV) / rs;
        }
        return ((il + i0) - voltageV * gsh) / k - a / rs * w;
    }

    /// <summary>Terminal voltage at a terminal current.</summary>
    /// <param name="p">Model parameters.</param>
    /// <param name="currentA">Terminal current [A].</param>
    /// <returns>Terminal voltage [V].</returns>
    public static double VoltageAtCurrent(in SingleDiodeParameters p, double currentA)
    {
        double il = p.PhotocurrentA, i0 = p.SaturationCurrentA, a = p.ModifiedIdealityV;
        double rs = p.SeriesResistanceOhm, gsh = p.ShuntConductanceS;
        double x = il + i0 - currentA;
        if (gsh <= 0.0)
        {
            // No shunt path: V = a ln((IL + I0 - I)/I0) - I Rs, defined for I < IL + I0.
            return x > 0 ? a * PortableMath.Log(x / i0) - currentA * rs : double.NegativeInfinity;
        }
        // Jain & Kapoor (2004) eq. 4: V = Rsh x - I Rs - a W(theta), ln theta = ln(Rsh I0/a) + Rsh x/a.
        double rsh = 1.0 / gsh;
        double lnL = PortableMath.Log(rsh * i0 / a);
        double z = lnL + rsh * x / a;
        double w = LambertW.WrightOmega(z);
        if (z > 1.0)
        {
            // Rsh x - a W = a (z - lnL) - a (z - ln W) = a (ln W - lnL).
            return a * (PortableMath.Log(w) - lnL) - currentA * rs;
        }
        return rsh * x - currentA * rs - a * w;
    }

    /// <summary>
    /// Slope dI/dV of the characteristic at a point on it, from implicit differentiation of the
    /// single-diode equation: dI/dV = -G / (1 + Rs G), G = I0/a exp((V + I Rs)/a) + Gsh.
    /// </summary>
    /// <param name="p">Model parameters.</param>
    /// <param name="voltageV">Terminal voltage [V] of the point.</param>
    /// <param name="currentA">Terminal current [A] of the point.</param>
    /// <returns>dI/dV [A/V] (negative).</returns>
    public static double SlopeAtPoint(in SingleDiodeParameters p, double voltageV, double currentA)
    {
        double vd = voltageV + currentA * p.SeriesResistanceOhm;
        // I0 exp(vd/a) taken from the equation itself: IL + I0 - I - vd Gsh. It cannot overflow.
        double diodeTerm = p.PhotocurrentA + p.SaturationCurrentA - currentA - vd * p.ShuntConductanceS;
        if (diodeTerm < p.SaturationCurrentA * 1e-300) diodeTerm = p.SaturationCurrentA * PortableMath.Exp(Math.Max(vd / p.ModifiedIdealityV, -700));
        double g = diodeTerm / p.ModifiedIdealityV + p.ShuntConductanceS;
        return -g / (1.0 + p.SeriesResistanceOhm * g);
    }

    /// <summary>Open-circuit voltage [V] (the voltage at zero current).</summary>
    /// <param name="p">Model parameters.</param>
    public static double OpenCircuitVoltageV(in SingleDiodeParameters p) =>
        p.PhotocurrentA <= 0 ? 0.0 : VoltageAtCurrent(p, 0.0);

    /// <summary>Short-circuit current [A] (the current at zero voltage).</summary>
    /// <param name="p">Model parameters.</param>
    public static double ShortCircuitCurrentA(in SingleDiodeParameters p) => CurrentAtVoltage(p, 0.0);

    /// <summary>
    /// The maximum power point of one device: the root of dP/dV = I + V dI/dV on (0, Voc), with the slope in
    /// closed form (<see cref="SlopeAtPoint"/>), found by bisection on its sign down to neighbouring doubles.
    /// dP/dV is positive at V = 0 (it equals Isc) and negative at Voc (it equals Voc dI/dV), and P(V) of one
    /// device has a single maximum, so the sign change is the maximum.
    /// </summary>
    /// <param name="p">Model parameters.</param>
    /// <returns>(voltage [V], current [A], power [W]) at the maximum.</returns>
    public static (double VoltageV, double CurrentA, double PowerW) MaximumPowerPoint(in SingleDiodeParameters p)
    {
        double voc = OpenCircuitVoltageV(p);
        if (voc <= 0) return (0, 0, 0);
        var copy = p;
        double vmp = Bisection.FindSignChange(v =>
        {
            double i = CurrentAtVoltage(copy, v);
            return i + v * SlopeAtPoint(copy, v, i) > 0;
        }, 0.0, voc);
        double imp = CurrentAtVoltage(p, vmp);
        return (vmp, imp, vmp * imp);
    }
}
