namespace MpptArena.Plant;

/// <summary>
/// Buck converter average model with the PV array on its input and a battery (open-circuit voltage E,
/// internal resistance R_b) on its output, V_o = E + R_b i. Continuous conduction:
/// C dv/dt = i_pv(v) - d i; L di/dt = d v - V_o - R_L i; in steady state V_o = D v (lossless).
/// Source: Erickson &amp; Maksimovic, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2.
/// Discontinuous conduction (Sun et al. 2001, see <see cref="AveragedConverter"/>): V_on = v - V_o,
/// V_off = V_o, L di/dt = d1 (v - V_o) - d2 V_o - R_L i, the switch (the array side) carries
/// i d1/(d1 + d2); in steady state the input current is D^2 Ts (v - E) / (2 L) (Erickson &amp; Maksimovic, ch. 5).
/// </summary>
public sealed class BuckFrontEnd(ConverterSettings settings) : AveragedConverter(settings)
{
    /// <inheritdoc/>
    protected override double LoopResistanceOhm => Settings.InductorResistanceOhm + Settings.BatteryResistanceOhm;

    /// <inheritdoc/>
    protected override (double OnV, double OffV) IntervalVoltages(double v, double i)
    {
        double vOut = Settings.BatteryVoltageV + Settings.BatteryResistanceOhm * i;
        return (v - vOut, vOut);
    }

    /// <inheritdoc/>
    protected override void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut, out double pLoss)
    {
        double r = Settings.InductorResistanceOhm;
        double vOut = Settings.BatteryVoltageV + Settings.BatteryResistanceOhm * i;
        pOut = vOut * i;
        if (OffInterval(d, i, v, out double d2))
        {
            dv = (ipv - d * i) / Settings.InputCapacitanceF;
            di = (d * v - vOut - r * i) / Settings.InductanceH;
            if (i <= 0 && di < 0) di = 0; // diode blocks
            pLoss = r * i * i;
            return;
        }
        double conducting = d + d2;
        dv = (ipv - i * d / conducting) / Settings.InputCapacitanceF;
        di = (d * (v - vOut) - d2 * vOut - r * i) / Settings.InductanceH;
        pLoss = r * i * i / conducting;
    }

    /// <inheritdoc/>
    protected override double DutyForInputCurrent(double v, double i, double inputCurrentRefA)
    {
        // Input current is d i in continuous conduction: the inductor must carry i_ref = i_in,ref / d. Solve d from
        // d v = E + (R_L + R_b) i + Kc (i_in,ref / d - i) with the previous inductor current as the guess.
        if (v <= 1e-9) return Settings.MinDuty;
        double e = Settings.BatteryVoltageV + (Settings.InductorResistanceOhm + Settings.BatteryResistanceOhm) * i - Kc * i;
        // d^2 v - e d - Kc i_in,ref = 0, positive root.
        double disc = e * e + 4 * v * Kc * Math.Max(inputCurrentRefA, 0.0);
        return (e + Math.Sqrt(Math.Max(disc, 0.0))) / (2 * v);
    }
}
