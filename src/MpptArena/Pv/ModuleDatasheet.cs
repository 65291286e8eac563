namespace MpptArena.Pv;

/// <summary>The electrical values a module datasheet gives at STC (1000 W/m2, 25 degC cell, AM1.5G).</summary>
/// <param name="ShortCircuitCurrentA">Isc at STC [A].</param>
/// <param name="OpenCircuitVoltageV">Voc at STC [V].</param>
/// <param name="MppCurrentA">Imp at STC [A].</param>
/// <param name="MppVoltageV">Vmp at STC [V].</param>
/// <param name="CellsInSeries">Cells in series in the module [-].</param>
/// <param name="IscTemperatureCoefficientAPerK">alpha_Isc, change of Isc with cell temperature [A/K].</param>
/// <param name="VocTemperatureCoefficientVPerK">beta_Voc, change of Voc with cell temperature [V/K] (negative).</param>
public sealed record ModuleDatasheet(
    double ShortCircuitCurrentA,
    double OpenCircuitVoltageV,
    double MppCurrentA,
    double MppVoltageV,
    int CellsInSeries,
    double IscTemperatureCoefficientAPerK,
    double VocTemperatureCoefficientVPerK);
