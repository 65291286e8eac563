namespace MpptArena.Pv;

/// <summary>
/// A module's single-diode model at reference conditions plus what the De Soto translation needs to
/// move it to any irradiance and cell temperature.
/// </summary>
/// <param name="Reference">Single-diode parameters of the whole module at reference conditions.</param>
/// <param name="CellsInSeries">Cells in series in the module [-].</param>
/// <param name="IscTemperatureCoefficientAPerK">alpha_Isc [A/K].</param>
/// <param name="ReferenceIrradianceWm2">Irradiance of the reference condition [W/m2], 1000 at STC.</param>
/// <param name="ReferenceCellTemperatureC">Cell temperature of the reference condition [degC], 25 at STC.</param>
/// <param name="BandGapEv">Band gap at the reference temperature [eV], 1.121 for crystalline silicon (De Soto 2006).</param>
public sealed record ModuleModel(
    SingleDiodeParameters Reference,
    int CellsInSeries,
    double IscTemperatureCoefficientAPerK,
    double ReferenceIrradianceWm2 = 1000.0,
    double ReferenceCellTemperatureC = 25.0,
    double BandGapEv = DeSotoTranslation.SiliconBandGapEv)
{
    /// <summary>
    /// Diode ideality factor n [-] per cell: a = n Ns k T / q at the reference temperature. About 1 to 2 for
    /// crystalline silicon (1 for pure diffusion current, 2 for recombination in the depletion region:
    /// C. T. Sah, R. N. Noyce, W. Shockley, Proc. IRE 45(9), 1957); a fit outside that range fits the curve
    /// but not the physics.
    /// </summary>
    public double IdealityFactor => Reference.ModifiedIdealityV / (CellsInSeries * PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(ReferenceCellTemperatureC)));

    /// <summary>Single-diode parameters of the whole module at an operating condition.</summary>
    /// <param name="irradianceWm2">Effective irradiance on the cells [W/m2].</param>
    /// <param name="cellTemperatureC">Cell temperature [degC].</param>
    public SingleDiodeParameters At(double irradianceWm2, double cellTemperatureC) =>
        DeSotoTranslation.Translate(this, irradianceWm2, cellTemperatureC);
}
