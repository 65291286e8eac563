using MpptArena.Arrays;
using MpptArena.Numerics;
using MpptArena.Trackers;

namespace MpptArena.Plant;

/// <summary>
/// An ideal voltage-controlled source: the PV voltage follows the reference through a first-order
/// lag, v' = (v_ref - v)/tau, integrated exactly (v(t+h) = v_ref + (v - v_ref) e^(-h/tau)). The
/// source cannot push current into the array, so the operating voltage is limited to [0, Voc].
/// </summary>
/// <remarks>
/// Energy over a step: with s = e^(-t/tau) the trajectory is linear in s, v = v_ref + dv s, and
/// int P dt = P(v_ref) h + tau int_{s1}^{1} [P(v_ref + dv s) - P(v_ref)] / s ds (s1 = e^(-h/tau)), whose
/// integrand is smooth even when the step spans many time constants. It is integrated by three-point
/// Gauss-Legendre quadrature on panels no wider than 5 V of trajectory, split where the trajectory
/// crosses open circuit (the clamp's kink) (Abramowitz and Stegun, Handbook of Mathematical Functions,
/// 1964, 25.4.29). So a step may be as long as the tracker's sample period.
/// </remarks>
public sealed class IdealSourceFrontEnd(ConverterSettings settings) : IFrontEnd
{
    private double _v, _vOperating, _i;
    private double _lastDtS = double.NaN, _decay;
    private EnergyLedger _energy;

    /// <inheritdoc/>
    public bool Accepts(TrackerCommandKind kind) => kind == TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public (double Min, double Max) CommandRange(TrackerCommandKind kind) => (0.0, settings.MaxVoltageReferenceV);

    /// <inheritdoc/>
    public void Reset(double voltageV)
    {
        _v = voltageV;
        _vOperating = voltageV;
        _i = 0;
        _energy = default;
    }

    /// <inheritdoc/>
    public void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        double tau = settings.LagTimeConstantS;
        if (dtS != _lastDtS)
        {
            // Runs step by one fixed h: the lag's decay over a step is computed once.
            _lastDtS = dtS;
            _decay = PortableMath.Exp(-dtS / tau);
        }
        double s1 = _decay;
        double voc = curve.OpenCircuitVoltageV;
        double dv = _v - command;
        double pRef = Power(curve, command, voc, out _);
        double e = pRef * dtS;
        if (dv != 0)
        {
            // The clamp at open circuit puts a kink where v = Voc: s* = (Voc - v_ref)/dv.
            double kink = (voc - command) / dv;
            if (kink > s1 && kink < 1)
            {
                e += tau * (Deviation(curve, command, dv, pRef, voc, s1, kink) + Deviation(curve, command, dv, pRef, voc, kink, 1.0));
            }
            else
            {
                e += tau * Deviation(curve, command, dv, pRef, voc, s1, 1.0);
            }
        }
        _v = command + dv * s1;
        Power(curve, _v, voc, out _i);
        _vOperating = Math.Clamp(_v, 0.0, voc);
        _energy.FromArrayJ += e;
        _energy.DeliveredJ += e;
    }

    /// <summary>int_{a}^{b} [P(v_ref + dv s) - P(v_ref)] / s ds by three-point Gauss-Legendre on panels of at most 5 V of trajectory.</summary>
    private static double Deviation(PreparedArrayCurve curve, double vRef, double dv, double pRef, double voc, double a, double b)
    {
        const double MaxPanelV = 5.0;
        int panels = Math.Clamp((int)Math.Ceiling(Math.Abs(dv) * (b - a) / MaxPanelV), 1, 64);
        double width = (b - a) / panels, sum = 0;
        double x = Math.Sqrt(0.6);
        for (int k = 0; k < panels; k++)
        {
            double mid = a + (k + 0.5) * width, half = 0.5 * width;
            double s0 = mid - half * x, s2 = mid + half * x;
            double f0 = (Power(curve, vRef + dv * s0, voc, out _) - pRef) / s0;
            double fm = (Power(curve, vRef + dv * mid, voc, out _) - pRef) / mid;
            double f2 = (Power(curve, vRef + dv * s2, voc, out _) - pRef) / s2;
            sum += half * (5.0 / 9.0 * (f0 + f2) + 8.0 / 9.0 * fm);
        }
        return sum;
    }

    private static double Power(PreparedArrayCurve curve, double v, double voc, out double current)
    {
        double op = Math.Clamp(v, 0.0, voc);
        current = Math.Max(curve.CurrentAtVoltage(op), 0.0);
        return op * current;
    }

    /// <inheritdoc/>
    public double PvVoltageV => _vOperating;

    /// <inheritdoc/>
    public double PvCurrentA => _i;

    /// <inheritdoc/>
    public double DutyCycle => double.NaN;

    /// <inheritdoc/>
    public double InductorCurrentA => double.NaN;

    /// <inheritdoc/>
    public double DiscontinuousTimeS => double.NaN;

    /// <inheritdoc/>
    public (double VoltageV, double PvCurrentA, double InductorCurrentA) InstantAt(double phase) => (PvVoltageV, PvCurrentA, double.NaN);

    /// <inheritdoc/>
    public EnergyLedger Energy => _energy;

    /// <inheritdoc/>
    public double StoredJ => 0;

    /// <inheritdoc/>
    public double FastestRateEstimatePerS(double maxConductanceS) => 0; // exact integration: no stability limit

    /// <inheritdoc/>
    public void SetStabilityBound(double maxConductanceS, double stabilityLimit)
    {
        // Exact integration: nothing to split.
    }
}
