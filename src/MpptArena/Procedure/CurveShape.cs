namespace MpptArena.Procedure;

/// <summary>The shape of a test array's characteristic at STC, as the ratios of the MPP to the curve's ends.</summary>
/// <param name="Name">Name in files and reports (snake_case).</param>
/// <param name="MppToOpenCircuitVoltage">Vmpp / Voc [-].</param>
/// <param name="MppToShortCircuitCurrent">Impp / Isc [-].</param>
/// <param name="CellOpenCircuitVoltageV">Open-circuit voltage of one cell, to choose the cell count [V].</param>
/// <param name="VocTemperatureCoefficientPerK">Relative change of Voc per kelvin [1/K] (negative); pins the ideality factor in the fit.</param>
/// <param name="IscTemperatureCoefficientPerK">Relative change of Isc per kelvin [1/K].</param>
public sealed record CurveShape(string Name, double MppToOpenCircuitVoltage, double MppToShortCircuitCurrent, double CellOpenCircuitVoltageV,
    double VocTemperatureCoefficientPerK, double IscTemperatureCoefficientPerK)
{
    /// <summary>Fill factor Vmpp Impp / (Voc Isc) [-].</summary>
    public double FillFactor => MppToOpenCircuitVoltage * MppToShortCircuitCurrent;
}
