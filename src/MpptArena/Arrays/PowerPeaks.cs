namespace MpptArena.Arrays;

/// <summary>All local maxima of a P-V curve, in rising voltage, and the global one.</summary>
/// <param name="Peaks">Local maxima ordered by voltage.</param>
/// <param name="GlobalIndex">Index of the global maximum in <see cref="Peaks"/>.</param>
public sealed record PowerPeaks(IReadOnlyList<PowerPeak> Peaks, int GlobalIndex)
{
    /// <summary>The global maximum power point.</summary>
    public PowerPeak Global => Peaks[GlobalIndex];

    /// <summary>An empty set for a curve that delivers no power (dark array).</summary>
    public static PowerPeaks None { get; } = new([new PowerPeak(0, 0, 0)], 0);
}
