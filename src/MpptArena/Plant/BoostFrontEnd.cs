namespace MpptArena.Plant;

/// <summary>
/// Boost converter average model with the PV array on its input and a fixed DC bus on its output.
/// Continuous conduction: L di/dt = v - (1 - d) V_bus - R_L i; C dv/dt = i_pv(v) - i; in steady state
/// v = (1 - D) V_bus (lossless). Source: Erickson &amp; Maksimovic, Fundamentals of Power Electronics, 2nd
/// ed., 2001, ch. 2. Discontinuous conduction (Sun et al. 2001, see <see cref="AveragedConverter"/>):
/// V_on = v, V_off = V_bus - v, L di/dt = d1 v - d2 (V_bus - v) - R_L i, the diode carries i d2/(d1 + d2);
/// in steady state (lossless) i = D^2 Ts v V_bus / (2 L (V_bus - v)) (Erickson &amp; Maksimovic, ch. 5).
/// </summary>
public sealed class BoostFrontEnd(ConverterSettings settings) : AveragedConverter(settings)
{
    /// <inheritdoc/>
    protected override bool InductorCarriesInputCurrent => true;

    /// <inheritdoc/>
    protected override (double OnV, double OffV) IntervalVoltages(double v, double i) => (v, Settings.BusVoltageV - v);

    /// <inheritdoc/>
    protected override void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut, out double pLoss)
    {
        double r = Settings.InductorResistanceOhm;
        dv = (ipv - i) / Settings.InputCapacitanceF;
        if (OffInterval(d, i, v, out double d2))
        {
            double vOut = (1 - d) * Settings.BusVoltageV;
            di = (v - vOut - r * i) / Settings.InductanceH;
            if (i <= 0 && di < 0) di = 0; // diode blocks
            pOut = vOut * i;
            pLoss = r * i * i;
            return;
        }
        double conducting = d + d2;
        di = (d * v - d2 * (Settings.BusVoltageV - v) - r * i) / Settings.InductanceH;
        pOut = Settings.BusVoltageV * i * d2 / conducting;
        pLoss = r * i * i / conducting;
    }

    /// <inheritdoc/>
    protected override double DutyForInputCurrent(double v, double i, double inputCurrentRefA)
    {
        // The inductor carries the input current. Choose (1 - d) V_bus = v - R_L i - Kc (i_ref - i),
        // so that L di/dt = Kc (i_ref - i) in continuous conduction.
        double vOut = v - Settings.InductorResistanceOhm * i - Kc * (inputCurrentRefA - i);
        return 1.0 - vOut / Settings.BusVoltageV;
    }
}
