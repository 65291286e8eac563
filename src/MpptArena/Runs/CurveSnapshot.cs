using MpptArena.Arrays;

namespace MpptArena.Runs;

/// <summary>The array's P-V curve at one instant, kept for plots.</summary>
/// <param name="TimeS">Instant [s].</param>
/// <param name="VoltageV">Curve voltages [V].</param>
/// <param name="PowerW">Curve powers [W].</param>
/// <param name="Peaks">Local and global maxima.</param>
public sealed record CurveSnapshot(double TimeS, IReadOnlyList<double> VoltageV, IReadOnlyList<double> PowerW, PowerPeaks Peaks);
