namespace MpptArena.Environment;

/// <summary>
/// The dynamic MPPT test sequences of EN 50530:2010 + A1:2013 (annex on dynamic MPPT efficiency):
/// irradiance ramps between a low and a high level at a series of slopes, each slope repeated a set
/// number of times, with a dwell at each level.
/// </summary>
/// <remarks>
/// Levels, slopes, repetitions and the 10 s dwell as quoted in the project's references (from memory
/// of the standard's annex; check against the standard before relying on them for compliance):
/// 10 % to 50 % of 1000 W/m2 at 0.5, 1, 2, 3, 5, 7, 10, 14, 20, 30, 50 W/m2/s with repetitions
/// 2, 2, 3, 4, 6, 8, 10, 10, 10, 10, 10; 30 % to 100 % at 10, 14, 20, 30, 50, 100 W/m2/s, 10 each.
/// </remarks>
public static class En50530RampSequence
{
    /// <summary>One block of the sequence: a slope and how many up-down cycles at it.</summary>
    /// <param name="SlopeWm2PerS">Irradiance slope [W/m2/s].</param>
    /// <param name="Repetitions">Up-down cycles [-].</param>
    public readonly record struct Block(double SlopeWm2PerS, int Repetitions);

    /// <summary>Slopes and repetitions of the 10 % - 50 % sequence.</summary>
    public static IReadOnlyList<Block> LowRange { get; } =
    [
        new(0.5, 2), new(1, 2), new(2, 3), new(3, 4), new(5, 6), new(7, 8),
        new(10, 10), new(14, 10), new(20, 10), new(30, 10), new(50, 10),
    ];

    /// <summary>Slopes and repetitions of the 30 % - 100 % sequence.</summary>
    public static IReadOnlyList<Block> HighRange { get; } =
    [
        new(10, 10), new(14, 10), new(20, 10), new(30, 10), new(50, 10), new(100, 10),
    ];

    /// <summary>Dwell at each level [s].</summary>
    public const double DwellS = 10.0;

    /// <summary>One ramp of the sequence, for reporting ramp by ramp.</summary>
    /// <param name="SlopeWm2PerS">Slope [W/m2/s].</param>
    /// <param name="StartS">Start of the block (first ramp up) [s].</param>
    /// <param name="EndS">End of the block (after the last dwell) [s].</param>
    public readonly record struct BlockWindow(double SlopeWm2PerS, double StartS, double EndS);

    /// <summary>
    /// Appends the sequence to <paramref name="builder"/>: first a dwell at the low level, then for
    /// each block and repetition a ramp up, a dwell, a ramp down, a dwell.
    /// </summary>
    /// <param name="builder">Profile being built; moved to the low level first.</param>
    /// <param name="lowWm2">Low level [W/m2].</param>
    /// <param name="highWm2">High level [W/m2].</param>
    /// <param name="blocks">Slopes and repetitions.</param>
    /// <param name="dwellS">Dwell at each level [s].</param>
    /// <returns>The time window of each block, for scoring per slope.</returns>
    public static IReadOnlyList<BlockWindow> Append(ProfileBuilder builder, double lowWm2, double highWm2, IReadOnlyList<Block> blocks, double dwellS = DwellS)
    {
        var windows = new List<BlockWindow>();
        builder.Step(lowWm2).Hold(dwellS);
        foreach (var block in blocks)
        {
            double start = builder.TimeS;
            double rampS = (highWm2 - lowWm2) / block.SlopeWm2PerS;
            for (int r = 0; r < block.Repetitions; r++)
            {
                builder.Ramp(highWm2, rampS).Hold(dwellS).Ramp(lowWm2, rampS).Hold(dwellS);
            }
            windows.Add(new BlockWindow(block.SlopeWm2PerS, start, builder.TimeS));
        }
        return windows;
    }
}
