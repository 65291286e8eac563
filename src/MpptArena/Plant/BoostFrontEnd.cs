namespace MpptArena.Plant;

/// <summary>
/// Boost converter average model with the PV array on its input and a fixed DC bus on its output:
/// L di/dt = v - (1 - d) V_bus - R_L i; C dv/dt = i_pv(v) - i. In steady state CCM, v = (1 - D) V_bus
/// (lossless). Source: Erickson &amp; Maksimovic, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2.
/// </summary>
public sealed class BoostFrontEnd(ConverterSettings settings) : AveragedConverter(settings)
{
    /// <inheritdoc/>
    protected override bool InductorCarriesInputCurrent => true;

    /// <inheritdoc/>
    protected override void StateDerivatives(double v, double i, double d, double ipv, out double dv, out double di, out double pOut)
    {
        double vOut = (1 - d) * Settings.BusVoltageV;
        dv = (ipv - i) / Settings.InputCapacitanceF;
        di = (v - vOut - Settings.InductorResistanceOhm * i) / Settings.InductanceH;
        if (i <= 0 && di < 0) di = 0; // diode blocks
        pOut = vOut * i;
    }

    /// <inheritdoc/>
    protected override double DutyForInputCurrent(double v, double i, double inputCurrentRefA)
    {
        // The inductor carries the input current. Choose (1 - d) V_bus = v - R_L i - Kc (i_ref - i),
        // so that L di/dt = Kc (i_ref - i).
        double vOut = v - Settings.InductorResistanceOhm * i - Kc * (inputCurrentRefA - i);
        return 1.0 - vOut / Settings.BusVoltageV;
    }
}
