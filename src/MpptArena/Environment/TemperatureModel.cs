namespace MpptArena.Environment;

/// <summary>How cell temperature is given: directly, or from ambient air by the NOCT relation.</summary>
/// <param name="Profile">Cell temperature [degC], or ambient temperature [degC] when <paramref name="NoctC"/> is set.</param>
/// <param name="NoctC">Nominal operating cell temperature [degC]; null when the profile is the cell temperature.</param>
public sealed record TemperatureModel(PiecewiseLinearProfile Profile, double? NoctC)
{
    /// <summary>Cell temperature [degC] at a time for a substring receiving <paramref name="irradianceWm2"/>.</summary>
    public double CellTemperatureC(double timeS, double irradianceWm2)
    {
        double t = Profile.ValueAt(timeS);
        return NoctC is { } noct ? Pv.NoctCellTemperature.CellTemperatureC(t, irradianceWm2, noct) : t;
    }
}
