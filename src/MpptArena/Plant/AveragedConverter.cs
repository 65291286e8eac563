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
/// Kluwer 2001, ch. 2 and 7, extended to discontinuous conduction by the full-order averaged model of
/// J. Sun, D. M. Mitchell, M. F. Greuel, P. T. Krein, R. M. Bass, "Averaged modeling of PWM converters
/// operating in discontinuous conduction mode", IEEE Trans. Power Electronics 16(4), 2001, 482-492: with
/// the switch on for d1 Ts (inductor voltage V_on) and the diode conducting for d2 Ts (inductor voltage
/// -V_off), the average inductor current i fixes d2 = 2 L i / (d1 Ts V_on) - d1 (eq. 17), capped at
/// 1 - d1 where the current no longer reaches zero (continuous conduction), so the model is continuous
/// across the boundary and equals the CCM model above it. The averaged state equations are then
/// L di/dt = d1 V_on - d2 V_off - R_L i, with the switch and diode currents i d1/(d1 + d2) and
/// i d2/(d1 + d2) (the triangle's shares). In DCM the inductor current has a fast real pole near
/// 2 V_off / (d1 Ts V_on), above the switching frequency; the integrator treats that part exactly
/// (<see cref="RungeKuttaStep"/>), so DCM costs no more steps than CCM. The current stays at zero only
/// where nothing drives it (no switching, or no forward voltage).
/// Voltage-reference control is cascaded as in average-current-mode firmware: an outer proportional
/// voltage loop with feed-forward of the PV current sets the converter input current
/// (i_in,ref = i_pv + Kv (v - v_ref)); an inner proportional current loop with duty feed-forward sets
/// the duty cycle. The duty feed-forward is the CCM relation, as firmware computes it; in continuous
/// conduction and away from the modulator's limits both loops are then first order (the PV voltage
/// follows a reference step with tau_v = C/Kv, the inductor current its reference with tau_i = L/Kc), so
/// the averaged model needs no integrator. In DCM the same duty gives a different current, so the loops
/// settle more slowly and with a steady error, as the real converter's do; a step towards open circuit
/// that asks for less than zero current is slew-limited to i_pv/C; an optional PI zero at f_z adds Ki = Kv 2 pi f_z (with
/// anti-windup) for users who want to see its effect. Gains follow from the requested bandwidths:
/// Kv = 2 pi f_v C, Kc = 2 pi f_i L. By default the loops act continuously, as analog or fast digital
/// loops do, so the model does not depend on the plant step; with a loop rate they update the duty
/// cycle at that rate and hold it in between (zero-order hold, at the loop's own instants whatever the
/// plant step). They see true values (their analog
/// sensing is much faster than the tracker's ADC path).
/// </remarks>
public abstract class AveragedConverter(ConverterSettings settings) : IFrontEnd
{
    /// <summary>Converter parameters.</summary>
    protected ConverterSettings Settings { get; } = settings;

    private double _v, _i, _duty, _integral, _untilUpdateS, _discontinuousS;
    private double _maxStableStepS = double.PositiveInfinity, _stabilityLimit = 2.0;
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
        _untilUpdateS = 0;
        _discontinuousS = 0;
        _energy = default;
        _lastCurve = null;
    }

    /// <summary>Sets the state to an operating point: the input capacitor at <paramref name="voltageV"/> [V], the inductor at <paramref name="inductorCurrentA"/> [A].</summary>
    public void Reset(double voltageV, double inductorCurrentA)
    {
        Reset(voltageV);
        _i = Math.Max(inductorCurrentA, 0.0);
    }

    /// <inheritdoc/>
    public double PvVoltageV => _v;

    /// <inheritdoc/>
    public double PvCurrentA => _lastCurve?.CurrentAtVoltage(_v) ?? 0.0;

    /// <summary>Inductor current [A].</summary>
    public double InductorCurrentA => _i;

    /// <inheritdoc/>
    public double DutyCycle => _duty;

    /// <summary>Switching period Ts [s].</summary>
    protected double SwitchingPeriodS => 1.0 / Settings.SwitchingFrequencyHz;

    /// <summary>Shortest sub-step a change of conduction mode is refined to [s]: an eighth of a switching period.</summary>
    private double RefinedStepS => 0.125 * SwitchingPeriodS;

    /// <summary>True when the inductor current falls to zero within each switching period at the present state and duty.</summary>
    public bool IsDiscontinuous => _i <= 0 || !OffInterval(_duty, _i, _v, out _);

    /// <summary>Time since reset spent in discontinuous conduction [s] (judged at the end of each step).</summary>
    public double DiscontinuousTimeS => _discontinuousS;

    /// <inheritdoc/>
    /// <remarks>
    /// The switching waveforms of the averaged state (Erickson and Maksimovic 2001, ch. 2 and 5): the
    /// inductor current is a triangle about its average, rising for d1 Ts and falling for the rest of
    /// the period in CCM (peak-to-peak (V_on - R_L i) d1 Ts / L), or rising from zero for d1 Ts, falling to zero in
    /// d2 Ts and resting at zero in DCM (peak 2 i / (d1 + d2), which is V_on d1 Ts / L in steady state).
    /// The converter's input current is that triangle (boost) or its part while the switch is on (buck);
    /// the input capacitor carries its difference from the mean, so the PV voltage ripple is
    /// (1/C) times its integral, piecewise quadratic, with zero mean over the period. The array current
    /// is the curve's at that instantaneous voltage.
    /// </remarks>
    public (double VoltageV, double PvCurrentA, double InductorCurrentA) InstantAt(double phase)
    {
        double d1 = _duty, i = _i;
        if (d1 <= 0 || d1 >= 1 || i <= 0) return (_v, PvCurrentA, i);
        bool continuous = OffInterval(d1, i, _v, out double d2);
        var (on, _) = IntervalVoltages(_v, i);
        // Inductor current at the segment ends: [0, d1] rising, [d1, e] falling, [e, 1] at zero (DCM).
        double start, peak, end = d1 + d2;
        if (continuous)
        {
            // The inductor's voltage while the switch is on, its resistive drop included.
            double ripple = Math.Max(on - Settings.InductorResistanceOhm * i, 0.0) * d1 * SwitchingPeriodS / Settings.InductanceH;
            start = i - 0.5 * ripple;
            peak = i + 0.5 * ripple;
        }
        else
        {
            start = 0;
            peak = end > 0 ? 2 * i / end : 0;
        }
        Span<double> bounds = [0, d1, end, 1];
        Span<double> fromA = [start, peak, 0];
        Span<double> toA = [peak, continuous ? start : 0, 0];
        bool inputWhenOff = InductorCarriesInputCurrent;
        phase -= Math.Floor(phase);

        // The input current's mean, the charge Q(theta) = integral of (mean - i_in) and its mean (Simpson's
        // rule, exact for the quadratic Q on each linear piece of i_in), in units of Ts.
        double meanIn = 0;
        for (int k = 0; k < 3; k++)
        {
            if (k > 0 && !inputWhenOff) break;
            meanIn += (bounds[k + 1] - bounds[k]) * 0.5 * (fromA[k] + toA[k]);
        }
        double q = 0, meanQ = 0, qAtPhase = 0, inductorAtPhase = 0;
        for (int k = 0; k < 3; k++)
        {
            double length = bounds[k + 1] - bounds[k];
            if (length <= 0) continue;
            double a = k == 0 || inputWhenOff ? fromA[k] : 0, b = k == 0 || inputWhenOff ? toA[k] : 0;
            double Charge(double s) => (meanIn - a) * s - 0.5 * (b - a) * s * s / length;
            meanQ += length / 6 * (q + 4 * (q + Charge(0.5 * length)) + q + Charge(length));
            if (phase >= bounds[k] && phase < bounds[k + 1])
            {
                double s = phase - bounds[k];
                qAtPhase = q + Charge(s);
                inductorAtPhase = fromA[k] + (toA[k] - fromA[k]) * s / length;
            }
            q += Charge(length);
        }
        double v = _v + SwitchingPeriodS / Settings.InputCapacitanceF * (qAtPhase - meanQ);
        return (v, _lastCurve?.CurrentAtVoltage(v) ?? 0.0, inductorAtPhase);
    }

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
        double currentLoop = (Kc + LoopResistanceOhm) / Settings.InductanceH;
        return Math.Max(Math.Max(rc, lc), Math.Max(voltageLoop, currentLoop));
    }

    /// <summary>Resistance in the inductor's loop [ohm]: R_L, and the battery's R_b for the buck.</summary>
    protected virtual double LoopResistanceOhm => Settings.InductorResistanceOhm;

    /// <inheritdoc/>
    public void SetStabilityBound(double maxConductanceS, double stabilityLimit)
    {
        double rate = FastestRateEstimatePerS(maxConductanceS);
        _stabilityLimit = stabilityLimit;
        _maxStableStepS = rate > 0 ? stabilityLimit / rate : double.PositiveInfinity;
    }

    /// <summary>
    /// True when, with continuous loops and a voltage reference, the inductor current is the converter's
    /// input current and the current loop makes L di/dt = Kc (i_ref - i) exactly (the boost); the closed
    /// loop can then be propagated exponentially (<see cref="TryClosedLoopStep"/>).
    /// </summary>
    protected virtual bool InductorCarriesInputCurrent => false;

    /// <inheritdoc/>
    /// <remarks>
    /// With continuous loops on a topology whose closed loop is linear apart from the array's incremental
    /// conductance (<see cref="InductorCarriesInputCurrent"/>), a step in continuous conduction is one
    /// exponential propagation (<see cref="TryClosedLoopStep"/>), stable and exact for any step while the
    /// conductance holds. Otherwise (duty-cycle commands, digital or integrating loops, a saturated
    /// modulator, discontinuous conduction, a blocking diode) the step is integrated in equal sub-steps no
    /// longer than the stability bound (<see cref="RungeKuttaStep"/>); digital loops end sub-steps at their
    /// own update instants.
    /// </remarks>
    public void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        Advance(dtS, curve, command, kind);
        // A plant that lost its numbers must stop the run, not score NaN energy as a result.
        if (!double.IsFinite(_v) || !double.IsFinite(_i))
        {
            throw new InvalidOperationException(
                $"the converter model's state became non-finite (PV voltage {_v} V, inductor current {_i} A) after a {dtS * 1e6:G4} us step at command {command}; this is a fault of the arena's integrator, not of the tracker");
        }
        if (IsDiscontinuous) _discontinuousS += dtS;
    }

    private void Advance(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        bool digital = kind == TrackerCommandKind.VoltageReference && Settings.VoltageLoopRateHz > 0;
        if (kind == TrackerCommandKind.VoltageReference && !digital && Ki == 0
            && InductorCarriesInputCurrent && TryClosedLoopStep(dtS, curve, command))
        {
            return;
        }
        double maxStepS = Math.Max(_maxStableStepS, DiscontinuousStableStepS(curve, command, kind));
        int substeps = dtS <= maxStepS ? 1 : (int)Math.Ceiling(dtS / maxStepS);
        double h = dtS / substeps;
        if (!digital)
        {
            for (int k = 0; k < substeps; k++) RungeKuttaStep(h, curve, command, kind);
            return;
        }
        // Digital loops: the duty cycle is updated every loop period, at the loop's own instants (which
        // need not fall on plant steps), and held in between; sub-steps end at those instants.
        double loopPeriodS = 1.0 / Settings.VoltageLoopRateHz;
        double tolS = 1e-9 * Math.Min(dtS, loopPeriodS);
        double leftS = dtS;
        while (leftS > tolS)
        {
            if (_untilUpdateS <= tolS)
            {
                UpdateDigitalLoop(curve, command, loopPeriodS);
                _untilUpdateS += loopPeriodS;
            }
            double segment = Math.Min(leftS, Math.Min(_untilUpdateS, h));
            if (leftS - segment <= tolS) segment = leftS;
            RungeKuttaStep(segment, curve, command, kind);
            leftS -= segment;
            _untilUpdateS -= segment;
        }
    }

    /// <summary>
    /// Longest stable sub-step [s] when the step starts in discontinuous conduction, else 0. There the
    /// inductor current's fast modes (DCM pole, current loop, LC) are all in the exactly integrated part
    /// of <see cref="ExponentialStages"/>, and what is left explicit is the capacitor voltage: rate
    /// (|g| + Kv) / C with the array's local incremental conductance g (the voltage loop's gain as a margin
    /// for duty-cycle commands too), within the same stability limit.
    /// </summary>
    private double DiscontinuousStableStepS(PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        double d = kind == TrackerCommandKind.DutyCycle ? Math.Clamp(command, Settings.MinDuty, Settings.MaxDuty) : _duty;
        if (d <= 0 || (_i > 0 && OffInterval(d, _i, _v, out _))) return 0.0;
        curve.CurrentAtVoltage(_v, out double g);
        return _stabilityLimit * Settings.InputCapacitanceF / (Math.Abs(g) + Kv);
    }

    /// <summary>
    /// One step of the closed voltage and current loops as an exponential propagation. In the deviations
    /// u = v - v_ref and x = i - i_ref(v), with i_ref = i_pv(v) + Kv u, the loops give exactly
    /// C du/dt = -Kv u - x and dx/dt = -(Kc/L) x - (g + Kv) du/dt, where g = di_pv/dv is the array's
    /// incremental conductance: a linear system once g is held. g is taken at the step's midpoint
    /// (predicted with g at its start), so the step is the exponential midpoint rule (second order, exact
    /// for a straight characteristic; M. Hochbruck, A. Ostermann, "Exponential integrators", Acta Numerica
    /// 19, 2010, 209-286). The energy ledger is integrated by Simpson's rule over start, midpoint and end.
    /// Returns false, leaving the state untouched, when the modulator would saturate or the conduction be
    /// discontinuous anywhere on those three points (the feed-forward is exact only in CCM); the caller
    /// then integrates the step by sub-steps.
    /// </summary>
    private bool TryClosedLoopStep(double h, PreparedArrayCurve curve, double vRef)
    {
        double c = Settings.InputCapacitanceF;
        double kv = Kv, lambda = Kc / Settings.InductanceH;
        double v0 = _v, i0 = _i;
        double ipv0 = curve.CurrentAtVoltage(v0, out double g0);
        double u0 = v0 - vRef, x0 = i0 - ipv0 - kv * u0;
        // Most refusals are already visible at the start (DCM at low light, a saturated modulator).
        if (!InLinearRange(v0, i0, ipv0 + kv * u0, out double p0Out)) return false;

        // Predictor: conductance at the start, half a step, to find the midpoint's conductance.
        var (uP, _) = Propagator(g0, 0.5 * h, c, kv, lambda).Times(u0, x0);
        curve.CurrentAtVoltage(vRef + uP, out double gMid);
        var half = Propagator(gMid, 0.5 * h, c, kv, lambda);
        var (uM, xM) = half.Times(u0, x0);
        var (u1, x1) = half.Times(uM, xM);

        double vM = vRef + uM, v1 = vRef + u1;
        double ipvM = curve.CurrentAtVoltage(vM), ipv1 = curve.CurrentAtVoltage(v1);
        double iM = xM + ipvM + kv * uM, i1 = x1 + ipv1 + kv * u1;
        if (!InLinearRange(vM, iM, ipvM + kv * uM, out double pMOut)
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
        return true;
    }

    /// <summary>exp(A t) of the closed loop in (u, x) with the array conductance <paramref name="g"/> [S] held.</summary>
    private static MatrixExponential2 Propagator(double g, double t, double c, double kv, double lambda)
    {
        double sigma = (g + kv) / c;
        return MatrixExponential2.Of(-kv / c, -1.0 / c, sigma * kv, sigma - lambda, t);
    }

    /// <summary>
    /// True when the loops at this point neither saturate the modulator nor leave continuous conduction
    /// (so the closed loop is the linear one); gives the output power [W].
    /// </summary>
    private bool InLinearRange(double v, double i, double inputCurrentRefA, out double pOut)
    {
        double d = DutyForInputCurrent(v, i, inputCurrentRefA);
        StateDerivatives(v, Math.Max(i, 0.0), d, 0.0, out _, out _, out pOut, out _);
        return i > 0 && d >= Settings.MinDuty && d <= Settings.MaxDuty && OffInterval(d, i, v, out _);
    }

    /// <summary>
    /// Anti-windup rule shared by the continuous and digital integrators: the loop is saturated when the
    /// modulator clamps the duty cycle or when it asks for a negative input current (the diode blocks it).
    /// </summary>
    private static bool Saturated(double duty, double clamped, double inputCurrentRefA) => clamped != duty || inputCurrentRefA < 0;

    private void UpdateDigitalLoop(PreparedArrayCurve curve, double command, double loopPeriodS)
    {
        double error = _v - command;
        double iRef = curve.CurrentAtVoltage(_v) + Kv * error + Ki * _integral;
        double duty = DutyForInputCurrent(_v, _i, iRef);
        double clamped = Math.Clamp(duty, Settings.MinDuty, Settings.MaxDuty);
        // Anti-windup: integrate only while the loop is not saturated, or when unwinding.
        if (Ki > 0 && (!Saturated(duty, clamped, iRef) || Math.Sign(error) != Math.Sign(_integral))) _integral += error * loopPeriodS;
        _duty = clamped;
    }

    /// <summary>
    /// One sub-step of <paramref name="dtS"/> [s] of the averaged model with the energy ledger as extra
    /// states. Classical fourth-order Runge-Kutta in general; where the sub-step starts or ends in
    /// discontinuous conduction with the inductor's fast pole lambda beyond h lambda = 1, the inductor
    /// current is integrated by the exponential time-differencing scheme ETDRK4 (S. M. Cox, P. C. Matthews,
    /// "Exponential time differencing for stiff systems", J. Computational Physics 176, 2002, 430-455,
    /// eqs. 26-29) with the linear part -lambda i exact, and the other states by the same stages (ETDRK4
    /// is classical RK4 where the linear part is zero). The scheme keeps every fixed point of the model.
    /// </summary>
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
        else if (continuous && Ki > 0)
        {
            double error = _v - command;
            double iRef = curve.CurrentAtVoltage(_v) + Kv * error + Ki * _integral;
            double duty = DutyForInputCurrent(_v, _i, iRef);
            double clamped = Math.Clamp(duty, Settings.MinDuty, Settings.MaxDuty);
            if (!Saturated(duty, clamped, iRef) || Math.Sign(error) != Math.Sign(_integral)) _integral += error * dtS;
        }

        var law = new DutyLaw(continuous, _duty, command, Ki * _integral);
        double v = _v, i = _i;
        var k1 = Derivatives(curve, v, i, law);
        double lambda = StiffRate(curve, v, i, law, k1);
        SubstepEnd next;
        double lambdaEnd;
        if (lambda * dtS > 1)
        {
            next = ExponentialStages(curve, dtS, law, lambda, k1, out lambdaEnd);
        }
        else
        {
            next = ClassicalStages(curve, dtS, law, k1, out lambdaEnd);
            // Entered deep DCM within the sub-step (its last stage): integrate it with the stiffness found there.
            if (lambdaEnd * dtS > 1)
            {
                // At least the last stage's pole: the step's end may itself be back in CCM (rate 0), and ETDRK4
                // needs a positive rate (its coefficients are 0/0 at zero).
                double vEnd = next.V, iEnd = Math.Max(next.I, 0.0);
                double rate = Math.Max(lambdaEnd, StiffRate(curve, vEnd, iEnd, law, Derivatives(curve, vEnd, iEnd, law)));
                next = ExponentialStages(curve, dtS, law, rate, k1, out _);
            }
        }
        // The conduction mode changes within the sub-step: the equations have a kink there (d2 reaches
        // 1 - d1), which a step across it resolves only to first order. Such a sub-step is cut into
        // quarters, down to an eighth of a switching period, so the error stays that of the smooth parts.
        if ((lambda > 0) != (lambdaEnd > 0) && dtS > RefinedStepS)
        {
            for (int q = 0; q < 4; q++) RungeKuttaStep(0.25 * dtS, curve, command, kind);
            return;
        }
        _v = next.V;
        _i = next.I;
        _energy.FromArrayJ += next.FromArrayJ;
        _energy.DeliveredJ += next.DeliveredJ;
        _energy.LossJ += next.LossJ;
        if (_i < 0)
        {
            // Diode blocks: the (tiny) inductor energy of the negative excursion is booked as loss.
            _energy.LossJ += 0.5 * Settings.InductanceH * _i * _i;
            _i = 0;
        }
        if (continuous) _duty = DutyAt(law, _v, _i, curve.CurrentAtVoltage(_v));
    }

    /// <summary>State and ledger increments at the end of a sub-step.</summary>
    private readonly record struct SubstepEnd(double V, double I, double FromArrayJ, double DeliveredJ, double LossJ);

    /// <summary>Classical RK4 from the first stage <paramref name="k1"/>; gives the fast pole's rate at the last stage's point.</summary>
    private SubstepEnd ClassicalStages(PreparedArrayCurve curve, double h, in DutyLaw law, in Stage k1, out double lambdaEnd)
    {
        double v = _v, i = _i;
        var k2 = Derivatives(curve, v + 0.5 * h * k1.Dv, i + 0.5 * h * k1.Di, law);
        var k3 = Derivatives(curve, v + 0.5 * h * k2.Dv, i + 0.5 * h * k2.Di, law);
        double v4 = v + h * k3.Dv, i4 = i + h * k3.Di;
        var k4 = Derivatives(curve, v4, i4, law);
        lambdaEnd = DiscontinuousPoleRate(k4.Duty, v4, Math.Max(i4, 0.0));
        return Combine(h, v + h / 6 * (k1.Dv + 2 * k2.Dv + 2 * k3.Dv + k4.Dv), i + h / 6 * (k1.Di + 2 * k2.Di + 2 * k3.Di + k4.Di), k1, k2, k3, k4);
    }

    /// <summary>
    /// ETDRK4 (Cox and Matthews 2002, eqs. 26-29) for di/dt = -lambda i + N with N = f_i + lambda i, and
    /// the classical RK4 stages for the capacitor voltage and the ledger.
    /// </summary>
    private SubstepEnd ExponentialStages(PreparedArrayCurve curve, double h, in DutyLaw law, double lambda, in Stage k1, out double lambdaEnd)
    {
        double v = _v, i = _i;
        double z = -lambda * h;
        double eHalf = PortableMath.Exp(0.5 * z), eFull = eHalf * eHalf;
        double q = (1 - eHalf) / lambda;
        double z3 = z * z * z;
        double w1 = h * (-4 - z + eFull * (4 - 3 * z + z * z)) / z3;
        double w2 = h * (2 + z + eFull * (z - 2)) / z3;
        double w3 = h * (-4 - 3 * z - z * z + eFull * (4 - z)) / z3;

        double n1 = k1.Di + lambda * i;
        double ia = i * eHalf + q * n1;
        var k2 = Derivatives(curve, v + 0.5 * h * k1.Dv, ia, law);
        double n2 = k2.Di + lambda * ia;
        double ib = i * eHalf + q * n2;
        var k3 = Derivatives(curve, v + 0.5 * h * k2.Dv, ib, law);
        double n3 = k3.Di + lambda * ib;
        double ic = ia * eHalf + q * (2 * n3 - n1);
        double v4 = v + h * k3.Dv;
        var k4 = Derivatives(curve, v4, ic, law);
        lambdaEnd = DiscontinuousPoleRate(k4.Duty, v4, Math.Max(ic, 0.0));
        double n4 = k4.Di + lambda * ic;
        return Combine(h, v + h / 6 * (k1.Dv + 2 * k2.Dv + 2 * k3.Dv + k4.Dv), i * eFull + w1 * n1 + 2 * w2 * (n2 + n3) + w3 * n4, k1, k2, k3, k4);
    }

    private static SubstepEnd Combine(double h, double v, double i, in Stage k1, in Stage k2, in Stage k3, in Stage k4) => new(v, i,
        h / 6 * (k1.PvPowerW + 2 * k2.PvPowerW + 2 * k3.PvPowerW + k4.PvPowerW),
        h / 6 * (k1.OutputPowerW + 2 * k2.OutputPowerW + 2 * k3.OutputPowerW + k4.OutputPowerW),
        h / 6 * (k1.LossPowerW + 2 * k2.LossPowerW + 2 * k3.LossPowerW + k4.LossPowerW));

    /// <summary>
    /// The rate [1/s] of the inductor current's linear part that ETDRK4 takes exactly, in DCM: -d(di/dt)/di
    /// at the point by a difference quotient (so it includes the continuous current loop's gain and the
    /// DCM pole's dependence on the duty cycle), at least the DCM pole's own rate; zero in CCM.
    /// </summary>
    private double StiffRate(PreparedArrayCurve curve, double v, double i, in DutyLaw law, in Stage at)
    {
        double pole = DiscontinuousPoleRate(at.Duty, v, Math.Max(i, 0.0));
        if (pole == 0) return 0.0;
        double delta = 1e-7 * Math.Max(Math.Abs(i), 1e-3);
        double slope = (Derivatives(curve, v, i + delta, law).Di - at.Di) / delta;
        return Math.Max(pole, -slope);
    }

    /// <summary>
    /// Rate of the inductor current's fast pole in discontinuous conduction [1/s]:
    /// lambda = 2 V_off / (d1 Ts V_on) + R_L / L, from d(d2)/di = 2 L / (d1 Ts V_on) in
    /// L di/dt = d1 V_on - d2 V_off - R_L i (Sun et al. 2001); zero in continuous conduction.
    /// </summary>
    private double DiscontinuousPoleRate(double d1, double v, double i)
    {
        if (OffInterval(d1, i, v, out _)) return 0.0;
        var (on, off) = IntervalVoltages(v, i);
        return 2 * off / (d1 * SwitchingPeriodS * on) + Settings.InductorResistanceOhm / Settings.InductanceH;
    }

    /// <summary>
    /// The diode's conduction interval d2 [-] for the switch's d1 at average inductor current
    /// <paramref name="i"/> [A]: 2 L i / (d1 Ts V_on) - d1 (Sun et al. 2001, eq. 17), at least 0, and
    /// 1 - d1 where that would exceed it. Returns true in continuous conduction (d2 = 1 - d1), including
    /// where nothing switches or there is no forward voltage (the CCM equations then hold, with the
    /// current held at zero by the caller).
    /// </summary>
    /// <param name="d1">Duty cycle [-].</param>
    /// <param name="i">Average inductor current [A].</param>
    /// <param name="v">Input-capacitor voltage [V].</param>
    /// <param name="d2">The diode's interval [-].</param>
    protected bool OffInterval(double d1, double i, double v, out double d2)
    {
        var (on, off) = IntervalVoltages(v, i);
        if (d1 <= 0 || on <= 0 || off <= 0)
        {
            d2 = 1 - d1;
            return true;
        }
        double x = 2 * Settings.InductanceH * i / (d1 * SwitchingPeriodS * on) - d1;
        if (x >= 1 - d1)
        {
            d2 = 1 - d1;
            return true;
        }
        d2 = Math.Max(x, 0.0);
        return false;
    }

    /// <summary>Inductor voltage with the switch on, V_on, and minus its voltage with the diode on, V_off [V].</summary>
    /// <param name="v">Input-capacitor voltage [V].</param>
    /// <param name="i">Average inductor current [A].</param>
    protected abstract (double OnV, double OffV) IntervalVoltages(double v, double i);

    /// <summary>How the duty cycle is found inside a step.</summary>
    private readonly record struct DutyLaw(bool Continuous, double HeldDuty, double ReferenceV, double IntegralA);

    private double DutyAt(in DutyLaw law, double v, double i, double ipv) =>
        law.Continuous
            ? Math.Clamp(DutyForInputCurrent(v, i, ipv + Kv * (v - law.ReferenceV) + law.IntegralA), Settings.MinDuty, Settings.MaxDuty)
            : law.HeldDuty;

    /// <summary>Time derivatives and powers at one point of a step, with the duty cycle there.</summary>
    private readonly record struct Stage(double Dv, double Di, double PvPowerW, double OutputPowerW, double LossPowerW, double Duty);

    private Stage Derivatives(PreparedArrayCurve curve, double v, double i, in DutyLaw law)
    {
        double ipv = curve.CurrentAtVoltage(v);
        double iPos = Math.Max(i, 0.0);
        double d = DutyAt(law, v, iPos, ipv);
        StateDerivatives(v, iPos, d, ipv, out double dv, out double di, out double pOut, out double pLoss);
        return new Stage(dv, di, v * ipv, pOut, pLoss, d);
    }

    /// <summary>Averaged state equations of the topology, continuous and discontinuous conduction.</summary>
    /// <param name="v">Input-capacitor voltage [V].</param>
    /// <param name="i">Average inductor current [A], not negative.</param>
    /// <param name="d">Duty cycle [-].</param>
    /// <param name="ipv">Array current at v [A].</param>
    /// <param name="dv">dv/dt [V/s].</param>
    /// <param name="di">di/dt [A/s].</param>
    /// <param name="pOut">Power delivered at the output [W].</param>
    /// <param name="pLoss">Power lost in the inductor's resistance [W]: R_L i^2 / (d1 + d2), the loss the averaged equations imply (R_L i^2 in CCM).</param>
    protected abstract void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut, out double pLoss);

    /// <summary>
    /// Duty cycle that drives the converter's input current toward <paramref name="inputCurrentRefA"/> with
    /// the current loop's bandwidth, from the CCM relations (as firmware computes its feed-forward).
    /// </summary>
    protected abstract double DutyForInputCurrent(double v, double i, double inputCurrentRefA);
}
