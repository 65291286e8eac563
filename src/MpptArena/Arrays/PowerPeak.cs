namespace MpptArena.Arrays;

/// <summary>A local maximum of the array's P-V curve.</summary>
/// <param name="VoltageV">Voltage of the maximum [V].</param>
/// <param name="CurrentA">Current at the maximum [A].</param>
/// <param name="PowerW">Power at the maximum [W].</param>
public readonly record struct PowerPeak(double VoltageV, double CurrentA, double PowerW);
