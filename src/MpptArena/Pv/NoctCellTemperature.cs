namespace MpptArena.Pv;

/// <summary>Cell temperature from ambient temperature and irradiance by the NOCT relation.</summary>
/// <remarks>
/// Tc = Ta + (NOCT - 20 degC) G / 800 W/m2. G. M. Masters, Renewable and Efficient Electric Power
/// Systems, Wiley 2004, eq. 5.23. NOCT conditions: 800 W/m2, 20 degC air, 1 m/s wind, open circuit.
/// </remarks>
public static class NoctCellTemperature
{
    /// <summary>Cell temperature [degC].</summary>
    /// <param name="ambientTemperatureC">Air temperature [degC].</param>
    /// <param name="irradianceWm2">Plane-of-array irradiance [W/m2].</param>
    /// <param name="noctC">Nominal operating cell temperature of the module [degC].</param>
    public static double CellTemperatureC(double ambientTemperatureC, double irradianceWm2, double noctC) =>
        ambientTemperatureC + (noctC - 20.0) * irradianceWm2 / 800.0;
}
