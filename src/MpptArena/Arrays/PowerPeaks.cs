namespace MpptArena.Arrays;

/// <summary>All local maxima of a P-V curve, in rising voltage, and the global one.</summary>
/// <param name="Peaks">Local maxima ordered by voltage.</param>
/// <param name="GlobalIndex">Index of the global maximum in <see cref="Peaks"/>.</param>
/// <param name="ValleysV">Voltage of the power minimum between each pair of neighbouring peaks [V]; one fewer than peaks.</param>
public sealed record PowerPeaks(IReadOnlyList<PowerPeak> Peaks, int GlobalIndex, IReadOnlyList<double> ValleysV)
{
    /// <summary>Voltage span [V] of the hill that holds the global maximum: between the valleys either side of it.</summary>
    public (double LowV, double HighV) GlobalHill =>
        (GlobalIndex == 0 ? double.NegativeInfinity : ValleysV[GlobalIndex - 1],
         GlobalIndex == Peaks.Count - 1 ? double.PositiveInfinity : ValleysV[GlobalIndex]);

    /// <summary>True if <paramref name="voltageV"/> lies on the hill of the global maximum.</summary>
    public bool IsOnGlobalHill(double voltageV)
    {
        var (lo, hi) = GlobalHill;
        return voltageV >= lo && voltageV <= hi;
    }

    /// <summary>The global maximum power point.</summary>
    public PowerPeak Global => Peaks[GlobalIndex];

    /// <summary>An empty set for a curve that delivers no power (dark array).</summary>
    public static PowerPeaks None { get; } = new([new PowerPeak(0, 0, 0)], 0, []);
}
