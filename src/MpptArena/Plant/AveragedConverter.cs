using MpptArena.Arrays;
using MpptArena.Numerics;
using MpptArena.Trackers;

namespace MpptArena.Plant;

/// <summary>
/// The parts shared by the averaged switching converters: state (input-capacitor voltage v, inductor
/// current i), the classical fourth-order Runge-Kutta step with the duty cycle either held over the step
/// (duty-cycle commands, digital loops) or computed from the state in every stage (continuous loops),
/// the inner control loops, and the energy ledger
/// integrated as extra states of the same step so the balance closes to the integrator's accuracy.
/// </summary>
/// <remarks>
/// Averaged CCM models after R. W. Erickson, D. Maksimovic, Fundamentals of Power Electronics, 2nd ed.,
/// Kluwer 2001, ch. 2 and 7. The inductor current is not allowed below zero (the diode blocks): the
/// model then stays at i = 0 instead of entering the discontinuous mode's averaged equations.
/// Voltage-reference control is cascaded as in average-current-mode firmware: an outer proportional
/// voltage loop with feed-forward of the PV current sets the converter input current
/// (i_in,ref = i_pv + Kv (v - v_ref)); an inner proportional current loop with duty feed-forward sets
/// the duty cycle. With exact feed-forward both loops are first order: the PV voltage follows a
/// reference step with tau_v = C/Kv and the inductor current its reference with tau_i = L/Kc, so the
/// averaged model needs no integrator; an optional PI zero at f_z adds Ki = Kv 2 pi f_z (with
/// anti-windup) for users who want to see its effect. Gains follow from the requested bandwidths:
/// Kv = 2 pi f_v C, Kc = 2 pi f_i L. By default the loops act continuously, as analog or fast digital
/// loops do, so the model does not depend on the plant step; with a loop rate they update the duty
/// cycle at that rate and hold it in between (zero-order hold). They see true values (their analog
/// sensing is much faster than the tracker's ADC path).
/// </remarks>
public abstract class AveragedConverter(ConverterSettings settings) : IFrontEnd
{
    /// <summary>Converter parameters.</summary>
    protected ConverterSettings Settings { get; } = settings;

    private double _v, _i, _duty, _integral, _sinceUpdateS;
    private double _maxStableStepS = double.PositiveInfinity;
    private PreparedArrayCurve? _lastCurve;
    private EnergyLedger _energy;

    private double Kv => 2 * Math.PI * Settings.VoltageLoopBandwidthHz * Settings.InputCapacitanceF;
    private double Ki => Kv * 2 * Math.PI * Settings.VoltageLoopIntegralHz;

    /// <summary>Current-loop gain Kc [V/A] = 2 pi f_i L.</summary>
    protected double Kc => 2 * Math.PI * Settings.CurrentLoopBandwidthHz * Settings.InductanceH;

    /// <inheritdoc/>
    public bool Accepts(TrackerCommandKind kind) => true;

    /// <inheritdoc/>
    public (double Min, double Max) CommandRange(TrackerCommandKind kind) =>
        kind == TrackerCommandKind.DutyCycle ? (Settings.MinDuty, Settings.MaxDuty) : (0.0, Settings.MaxVoltageReferenceV);

    /// <inheritdoc/>
    public void Reset(double voltageV)
    {
        _v = voltageV;
        _i = 0;
        _duty = Settings.MinDuty;
        _integral = 0;
        _sinceUpdateS = double.PositiveInfinity;
        _energy = default;
        _lastCurve = null;
    }

    /// <inheritdoc/>
    public double PvVoltageV => _v;

    /// <inheritdoc/>
    public double PvCurrentA => _lastCurve?.CurrentAtVoltage(_v) ?? 0.0;

    /// <summary>Inductor current [A].</summary>
    public double InductorCurrentA => _i;

    /// <inheritdoc/>
    public double DutyCycle => _duty;

    /// <inheritdoc/>
    public EnergyLedger Energy => _energy;

    /// <inheritdoc/>
    public double StoredJ => 0.5 * Settings.InputCapacitanceF * _v * _v + 0.5 * Settings.InductanceH * _i * _i;

    /// <inheritdoc/>
    public double FastestRateEstimatePerS(double maxConductanceS)
    {
        double rc = maxConductanceS / Settings.InputCapacitanceF;
        double lc = 1.0 / Math.Sqrt(Settings.InductanceH * Settings.InputCapacitanceF);
        double voltageLoop = (Kv + maxConductanceS) / Settings.InputCapacitanceF;
        double currentLoop = (Kc + Settings.InductorResistanceOhm) / Settings.InductanceH;
        return Math.Max(Math.Max(rc, lc), Math.Max(voltageLoop, currentLoop));
    }

    /// <inheritdoc/>
    public void SetStabilityBound(double maxConductanceS, double stabilityLimit)
    {
        double rate = FastestRateEstimatePerS(maxConductanceS);
        _maxStableStepS = rate > 0 ? stabilityLimit / rate : double.PositiveInfinity;
    }

    /// <summary>
    /// True when, with continuous loops and a voltage reference, the inductor current is the converter's
    /// input current and the current loop makes L di/dt = Kc (i_ref - i) exactly (the boost); the closed
    /// loop can then be propagated exponentially (<see cref="TryClosedLoopStep"/>).
    /// </summary>
    protected virtual bool InductorCarriesInputCurrent => false;

    private double LoopPeriodS(double dtS) =>
        Settings.VoltageLoopRateHz > 0 ? 1.0 / Settings.VoltageLoopRateHz - 0.5 * dtS : 0.0;

    /// <inheritdoc/>
    /// <remarks>
    /// With continuous loops on a topology whose closed loop is linear apart from the array's incremental
    /// conductance (<see cref="InductorCarriesInputCurrent"/>), the whole step is one exponential
    /// propagation (<see cref="TryClosedLoopStep"/>), stable and exact for any step while the conductance
    /// holds. Otherwise (duty-cycle commands, digital or integrating loops, a saturated modulator, a blocking
    /// diode) classical RK4 runs in equal sub-steps no longer than the stability bound.
    /// </remarks>
    public void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        if (kind == TrackerCommandKind.VoltageReference && Settings.VoltageLoopRateHz <= 0 && Ki == 0
            && InductorCarriesInputCurrent && TryClosedLoopStep(dtS, curve, command))
        {
            return;
        }
        int substeps = dtS <= _maxStableStepS ? 1 : (int)Math.Ceiling(dtS / _maxStableStepS);
        double h = dtS / substeps;
        for (int k = 0; k < substeps; k++) RungeKuttaStep(h, curve, command, kind);
    }

    /// <summary>
    /// One step of the closed voltage and current loops as an exponential propagation. In the deviations
    /// u = v - v_ref and x = i - i_ref(v), with i_ref = i_pv(v) + Kv u, the loops give exactly
    /// C du/dt = -Kv u - x and dx/dt = -(Kc/L) x - (g + Kv) du/dt, where g = di_pv/dv is the array's
    /// incremental conductance: a linear system once g is held. g is taken at the step's midpoint
    /// (predicted with g at its start), so the step is the exponential midpoint rule (second order, exact
    /// for a straight characteristic; M. Hochbruck, A. Ostermann, "Exponential integrators", Acta Numerica
    /// 19, 2010, 209-286). The energy ledger is integrated by Simpson's rule over start, midpoint and end.
    /// Returns false, leaving the state untouched, when the modulator would saturate or the inductor
    /// current would reverse anywhere on those three points; the caller then integrates the step by RK4.
    /// </summary>
    private bool TryClosedLoopStep(double h, PreparedArrayCurve curve, double vRef)
    {
        double c = Settings.InputCapacitanceF;
        double kv = Kv, lambda = Kc / Settings.InductanceH;
        double v0 = _v, i0 = _i;
        double ipv0 = curve.CurrentAtVoltage(v0, out double g0);
        double u0 = v0 - vRef, x0 = i0 - ipv0 - kv * u0;

        // Predictor: conductance at the start, half a step, to find the midpoint's conductance.
        var (uP, _) = Propagator(g0, 0.5 * h, c, kv, lambda).Times(u0, x0);
        curve.CurrentAtVoltage(vRef + uP, out double gMid);
        var half = Propagator(gMid, 0.5 * h, c, kv, lambda);
        var (uM, xM) = half.Times(u0, x0);
        var (u1, x1) = half.Times(uM, xM);

        double vM = vRef + uM, v1 = vRef + u1;
        double ipvM = curve.CurrentAtVoltage(vM), ipv1 = curve.CurrentAtVoltage(v1);
        double iM = xM + ipvM + kv * uM, i1 = x1 + ipv1 + kv * u1;
        if (!InLinearRange(v0, i0, ipv0 + kv * u0, out double p0Out)
            || !InLinearRange(vM, iM, ipvM + kv * uM, out double pMOut)
            || !InLinearRange(v1, i1, ipv1 + kv * u1, out double p1Out))
        {
            return false;
        }
        double r = Settings.InductorResistanceOhm;
        _energy.FromArrayJ += h / 6 * (v0 * ipv0 + 4 * vM * ipvM + v1 * ipv1);
        _energy.DeliveredJ += h / 6 * (p0Out + 4 * pMOut + p1Out);
        _energy.LossJ += h / 6 * r * (i0 * i0 + 4 * iM * iM + i1 * i1);
        _v = v1;
        _i = i1;
        _duty = DutyForInputCurrent(v1, i1, ipv1 + kv * u1);
        _lastCurve = curve;
        _sinceUpdateS = double.PositiveInfinity;
        return true;
    }

    /// <summary>exp(A t) of the closed loop in (u, x) with the array conductance <paramref name="g"/> [S] held.</summary>
    private static MatrixExponential2 Propagator(double g, double t, double c, double kv, double lambda)
    {
        double sigma = (g + kv) / c;
        return MatrixExponential2.Of(-kv / c, -1.0 / c, sigma * kv, sigma - lambda, t);
    }

    /// <summary>True when the loops at this point neither saturate the modulator nor reverse the inductor current; gives the output power [W].</summary>
    private bool InLinearRange(double v, double i, double inputCurrentRefA, out double pOut)
    {
        double d = DutyForInputCurrent(v, i, inputCurrentRefA);
        StateDerivatives(v, Math.Max(i, 0.0), d, 0.0, out _, out _, out pOut);
        return i >= 0 && d >= Settings.MinDuty && d <= Settings.MaxDuty;
    }

    private void RungeKuttaStep(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        // Continuous (analog) loops: the duty cycle follows the state inside every stage of the step, so
        // the model does not change with the plant step; digital loops hold it between updates.
        bool continuous = kind == TrackerCommandKind.VoltageReference && Settings.VoltageLoopRateHz <= 0;
        _lastCurve = curve;
        if (kind == TrackerCommandKind.DutyCycle)
        {
            _duty = Math.Clamp(command, Settings.MinDuty, Settings.MaxDuty);
        }
        else if (continuous)
        {
            if (Ki > 0)
            {
                double error = _v - command;
                double duty = DutyForInputCurrent(_v, _i, curve.CurrentAtVoltage(_v) + Kv * error + Ki * _integral);
                double clamped = Math.Clamp(duty, Settings.MinDuty, Settings.MaxDuty);
                if (clamped == duty || Math.Sign(error) != Math.Sign(_integral)) _integral += error * dtS;
            }
        }
        else if (_sinceUpdateS >= LoopPeriodS(dtS))
        {
            double ipv = curve.CurrentAtVoltage(_v);
            double error = _v - command;
            double duty = DutyForInputCurrent(_v, _i, ipv + Kv * error + Ki * _integral);
            double clamped = Math.Clamp(duty, Settings.MinDuty, Settings.MaxDuty);
            // Anti-windup: integrate only while the modulator is not saturated, or when unwinding.
            double period = double.IsPositiveInfinity(_sinceUpdateS) ? dtS : _sinceUpdateS;
            if (Ki > 0 && (clamped == duty || Math.Sign(error) != Math.Sign(_integral))) _integral += error * period;
            _duty = clamped;
            _sinceUpdateS = 0;
        }
        _sinceUpdateS += dtS;

        // Classical RK4 on (v, i, E_pv, E_out, E_loss); d held (digital) or a function of the state (continuous).
        var law = new DutyLaw(continuous, _duty, command, Ki * _integral);
        Derivatives(curve, _v, _i, law, out double k1v, out double k1i, out double p1, out double o1, out double l1);
        Derivatives(curve, _v + 0.5 * dtS * k1v, _i + 0.5 * dtS * k1i, law, out double k2v, out double k2i, out double p2, out double o2, out double l2);
        Derivatives(curve, _v + 0.5 * dtS * k2v, _i + 0.5 * dtS * k2i, law, out double k3v, out double k3i, out double p3, out double o3, out double l3);
        Derivatives(curve, _v + dtS * k3v, _i + dtS * k3i, law, out double k4v, out double k4i, out double p4, out double o4, out double l4);
        _v += dtS / 6 * (k1v + 2 * k2v + 2 * k3v + k4v);
        _i += dtS / 6 * (k1i + 2 * k2i + 2 * k3i + k4i);
        _energy.FromArrayJ += dtS / 6 * (p1 + 2 * p2 + 2 * p3 + p4);
        _energy.DeliveredJ += dtS / 6 * (o1 + 2 * o2 + 2 * o3 + o4);
        _energy.LossJ += dtS / 6 * (l1 + 2 * l2 + 2 * l3 + l4);
        if (_i < 0)
        {
            // Diode blocks: the (tiny) inductor energy of the negative excursion is booked as loss.
            _energy.LossJ += 0.5 * Settings.InductanceH * _i * _i;
            _i = 0;
        }
        if (continuous) _duty = DutyAt(law, _v, _i, curve.CurrentAtVoltage(_v));
    }

    /// <summary>How the duty cycle is found inside a step.</summary>
    private readonly record struct DutyLaw(bool Continuous, double HeldDuty, double ReferenceV, double IntegralA);

    private double DutyAt(in DutyLaw law, double v, double i, double ipv) =>
        law.Continuous
            ? Math.Clamp(DutyForInputCurrent(v, i, ipv + Kv * (v - law.ReferenceV) + law.IntegralA), Settings.MinDuty, Settings.MaxDuty)
            : law.HeldDuty;

    private void Derivatives(PreparedArrayCurve curve, double v, double i, in DutyLaw law,
        out double dv, out double di, out double pPv, out double pOut, out double pLoss)
    {
        double ipv = curve.CurrentAtVoltage(v);
        double iPos = Math.Max(i, 0.0);
        double d = DutyAt(law, v, iPos, ipv);
        StateDerivatives(v, iPos, d, ipv, out dv, out di, out pOut);
        pPv = v * ipv;
        pLoss = Settings.InductorResistanceOhm * iPos * iPos;
    }

    /// <summary>Averaged state equations of the topology.</summary>
    /// <param name="v">Input-capacitor voltage [V].</param>
    /// <param name="i">Inductor current [A], not negative.</param>
    /// <param name="d">Duty cycle [-].</param>
    /// <param name="ipv">Array current at v [A].</param>
    /// <param name="dv">dv/dt [V/s].</param>
    /// <param name="di">di/dt [A/s].</param>
    /// <param name="pOut">Power delivered at the output [W].</param>
    protected abstract void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut);

    /// <summary>Duty cycle that drives the converter's input current toward <paramref name="inputCurrentRefA"/> with the current loop's bandwidth.</summary>
    protected abstract double DutyForInputCurrent(double v, double i, double inputCurrentRefA);
}
