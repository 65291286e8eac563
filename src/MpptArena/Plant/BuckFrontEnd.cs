namespace MpptArena.Plant;

/// <summary>
/// Buck converter average model with the PV array on its input and a battery (open-circuit voltage E,
/// internal resistance R_b) on its output: C dv/dt = i_pv(v) - d i; L di/dt = d v - E - (R_L + R_b) i.
/// In steady state CCM the output voltage is D times the input (Vout = D Vin, lossless).
/// Source: Erickson &amp; Maksimovic, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2.
/// </summary>
public sealed class BuckFrontEnd(ConverterSettings settings) : AveragedConverter(settings)
{
    /// <inheritdoc/>
    protected override void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut)
    {
        double vOut = Settings.BatteryVoltageV + Settings.BatteryResistanceOhm * i;
        dv = (ipv - d * i) / Settings.InputCapacitanceF;
        di = (d * v - vOut - Settings.InductorResistanceOhm * i) / Settings.InductanceH;
        if (i <= 0 && di < 0) di = 0; // diode blocks
        pOut = vOut * i;
    }

    /// <inheritdoc/>
    protected override double DutyForInputCurrent(double v, double i, double inputCurrentRefA)
    {
        // Input current is d i: the inductor must carry i_ref = i_in,ref / d. Solve d from
        // d v = E + (R_L + R_b) i + Kc (i_in,ref / d - i) with the previous inductor current as the guess.
        if (v <= 1e-9) return Settings.MinDuty;
        double e = Settings.BatteryVoltageV + (Settings.InductorResistanceOhm + Settings.BatteryResistanceOhm) * i - Kc * i;
        // d^2 v - e d - Kc i_in,ref = 0, positive root.
        double disc = e * e + 4 * v * Kc * Math.Max(inputCurrentRefA, 0.0);
        return (e + Math.Sqrt(Math.Max(disc, 0.0))) / (2 * v);
    }
}
