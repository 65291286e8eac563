namespace MpptArena.Scoring;

/// <summary>Energy-ratio tracking efficiency over one window (EN 50530 / IEC 62891 definition).</summary>
/// <param name="Name">Window name.</param>
/// <param name="StartS">Start [s].</param>
/// <param name="EndS">End [s].</param>
/// <param name="SlopeWm2PerS">Ramp slope of the window [W/m2/s], if a ramp block.</param>
/// <param name="EnergyWh">Energy taken from the array [Wh].</param>
/// <param name="AvailableWh">Energy available at the true global MPP [Wh].</param>
/// <param name="Efficiency">EnergyWh / AvailableWh [-]; null when nothing was available (a dark window).</param>
public sealed record WindowScore(string Name, double StartS, double EndS, double? SlopeWm2PerS, double EnergyWh, double AvailableWh, double? Efficiency);
