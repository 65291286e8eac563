using MpptArena.Arrays;
using MpptArena.Plant;

namespace MpptArena.Tests.Plant;

/// <summary>
/// A cycle-by-cycle simulation of the switched boost or buck converter, independent of the averaged
/// model: the circuit is integrated through every switching period with the switch and the diode as
/// ideal switches (the inductor resistance in series), so ripple and discontinuous conduction arise by
/// themselves. Each interval (switch on; diode on; both off once the inductor current reaches zero)
/// is a smooth ODE, integrated by classical RK4 in equal steps that end on the PWM edges; the diode's
/// turn-off at zero current is located by the secant method within its step and the step is split
/// there. Circuit equations from Erickson and Maksimovic, Fundamentals of Power Electronics, 2nd ed.,
/// 2001, ch. 2 (boost and buck switch networks), with the PV array as the source.
/// </summary>
internal sealed class SwitchedConverterReference(PreparedArrayCurve curve, ConverterSettings settings, int stepsPerPeriod = 200)
{
    private readonly double _c = settings.InputCapacitanceF, _l = settings.InductanceH, _r = settings.InductorResistanceOhm;
    private readonly double _ts = 1 / settings.SwitchingFrequencyHz;
    private readonly bool _boost = settings.Kind == FrontEndKind.Boost;

    /// <summary>Input-capacitor voltage [V].</summary>
    public double V { get; private set; }

    /// <summary>Inductor current [A].</summary>
    public double I { get; private set; }

    /// <summary>Mean capacitor voltage over the last period [V].</summary>
    public double MeanV { get; private set; }

    /// <summary>Mean inductor current over the last period [A].</summary>
    public double MeanI { get; private set; }

    /// <summary>Peak-to-peak inductor current in the last period [A].</summary>
    public double RippleI { get; private set; }

    /// <summary>Peak-to-peak capacitor voltage in the last period [V].</summary>
    public double RippleV { get; private set; }

    /// <summary>Fraction of the last period with zero inductor current [-].</summary>
    public double ZeroFraction { get; private set; }

    /// <summary>Sets the state.</summary>
    public void Reset(double v, double i)
    {
        V = v;
        I = i;
    }

    /// <summary>One switching period at duty cycle <paramref name="duty"/>.</summary>
    public void Period(double duty)
    {
        _sumV = _sumI = _zeroS = 0;
        _minI = _maxI = I;
        _minV = _maxV = V;
        int on = Math.Max(1, (int)Math.Round(stepsPerPeriod * duty));
        int off = Math.Max(1, stepsPerPeriod - on);
        if (duty > 0) Interval(duty * _ts, on, switchOn: true);
        if (duty < 1) Interval((1 - duty) * _ts, off, switchOn: false);
        MeanV = _sumV / _ts;
        MeanI = _sumI / _ts;
        RippleI = _maxI - _minI;
        RippleV = _maxV - _minV;
        ZeroFraction = _zeroS / _ts;
    }

    private double _sumV, _sumI, _zeroS, _minI, _maxI, _minV, _maxV;

    private void Interval(double lengthS, int steps, bool switchOn)
    {
        double h = lengthS / steps;
        for (int k = 0; k < steps; k++)
        {
            bool conducting = switchOn || I > 0;
            var (v1, i1) = Rk4(V, I, h, switchOn, conducting);
            if (conducting && !switchOn && i1 < 0)
            {
                // The diode turns off within this step: find the zero of i by the secant method.
                double lo = 0, hi = h, iLo = I, iHi = i1;
                for (int it = 0; it < 30 && hi - lo > 1e-15; it++)
                {
                    double t = lo + (hi - lo) * iLo / (iLo - iHi);
                    double iT = Rk4(V, I, t, false, true).I;
                    if (iT > 0) { lo = t; iLo = iT; } else { hi = t; iHi = iT; }
                    if (Math.Abs(iT) < 1e-12) { lo = hi = t; break; }
                }
                double tz = 0.5 * (lo + hi);
                var (vz, _) = Rk4(V, I, tz, false, true);
                Accumulate(V, I, vz, 0, tz);
                V = vz;
                I = 0;
                var (v2, _) = Rk4(V, 0, h - tz, false, false);
                Accumulate(V, 0, v2, 0, h - tz);
                _zeroS += h - tz;
                V = v2;
                continue;
            }
            if (!conducting)
            {
                i1 = 0;
                _zeroS += h;
            }
            Accumulate(V, I, v1, i1, h);
            V = v1;
            I = i1;
        }
    }

    private void Accumulate(double v0, double i0, double v1, double i1, double h)
    {
        _sumV += 0.5 * h * (v0 + v1);
        _sumI += 0.5 * h * (i0 + i1);
        _minI = Math.Min(_minI, i1);
        _maxI = Math.Max(_maxI, i1);
        _minV = Math.Min(_minV, v1);
        _maxV = Math.Max(_maxV, v1);
    }

    private (double V, double I) Rk4(double v, double i, double h, bool switchOn, bool conducting)
    {
        var (a1, b1) = F(v, i, switchOn, conducting);
        var (a2, b2) = F(v + 0.5 * h * a1, i + 0.5 * h * b1, switchOn, conducting);
        var (a3, b3) = F(v + 0.5 * h * a2, i + 0.5 * h * b2, switchOn, conducting);
        var (a4, b4) = F(v + h * a3, i + h * b3, switchOn, conducting);
        return (v + h / 6 * (a1 + 2 * a2 + 2 * a3 + a4), i + h / 6 * (b1 + 2 * b2 + 2 * b3 + b4));
    }

    /// <summary>dv/dt and di/dt of the circuit in one switch state.</summary>
    private (double Dv, double Di) F(double v, double i, bool switchOn, bool conducting)
    {
        double ipv = curve.CurrentAtVoltage(v);
        if (!conducting) return (ipv / _c, 0);
        if (_boost)
        {
            // Switch on: the inductor sees the PV voltage; diode on: PV voltage minus the bus.
            double vL = switchOn ? v - _r * i : v - settings.BusVoltageV - _r * i;
            return ((ipv - i) / _c, vL / _l);
        }
        double vOut = settings.BatteryVoltageV + settings.BatteryResistanceOhm * i;
        return switchOn
            ? ((ipv - i) / _c, (v - vOut - _r * i) / _l)
            : (ipv / _c, (-vOut - _r * i) / _l);
    }
}
