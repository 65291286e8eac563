namespace MpptArena.Environment;

/// <summary>How cell temperature is given: directly, or from ambient air by the NOCT relation.</summary>
/// <param name="Profile">Cell temperature [degC], or ambient temperature [degC] when <paramref name="NoctC"/> is set.</param>
/// <param name="NoctC">Nominal operating cell temperature [degC]; null when the profile is the cell temperature.</param>
public sealed record TemperatureModel(PiecewiseLinearProfile Profile, double? NoctC)
{
    /// <summary>Cell temperature [degC] at a time for a substring receiving <paramref name="irradianceWm2"/>.</summary>
    public double CellTemperatureC(double timeS, double irradianceWm2) => CellTemperatureFromProfileValue(Profile.ValueAt(timeS), irradianceWm2);

    /// <summary>Cell temperature [degC] from the profile's value at the time [degC] and the substring's irradiance [W/m2].</summary>
    public double CellTemperatureFromProfileValue(double profileValueC, double irradianceWm2) =>
        NoctC is { } noct ? Pv.NoctCellTemperature.CellTemperatureC(profileValueC, irradianceWm2, noct) : profileValueC;
}
