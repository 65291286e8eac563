using System.Globalization;

namespace MpptArena.Runs;

/// <summary>The seeds of a multi-seed run: how they are written in a scenario or on the command line.</summary>
public static class SeedSet
{
    /// <summary>Most seeds one run may ask for.</summary>
    public const int MaxSeeds = 10_000;

    /// <summary><paramref name="count"/> consecutive seeds from <paramref name="first"/> (wrapping past the largest seed).</summary>
    public static IReadOnlyList<ulong> Consecutive(ulong first, int count)
    {
        var seeds = new ulong[count];
        for (int k = 0; k < count; k++) seeds[k] = unchecked(first + (ulong)k);
        return seeds;
    }

    /// <summary>
    /// The seeds of a <c>--seeds</c> option: a count N (N seeds from <paramref name="first"/>) or a comma-separated
    /// list of distinct seeds.
    /// </summary>
    /// <exception cref="ArenaInputException">Neither a count from 1 to <see cref="MaxSeeds"/> nor a list of distinct whole numbers.</exception>
    public static IReadOnlyList<ulong> ParseOption(string text, ulong first)
    {
        const string expected = $"a count from 1 to 10000 (e.g. --seeds 16) or a comma-separated list of distinct seeds (e.g. --seeds 3,5,8)";
        if (!text.Contains(','))
        {
            if (int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out int count) && count >= 1 && count <= MaxSeeds) return Consecutive(first, count);
            throw new ArenaInputException($"--seeds '{text}' is not valid: expected {expected}", "--seeds");
        }
        var seeds = new List<ulong>();
        foreach (string part in text.Split(','))
        {
            if (!ulong.TryParse(part.Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed))
                throw new ArenaInputException($"--seeds entry '{part}' is not a whole number from 0 to 18446744073709551615: expected {expected}", "--seeds");
            if (seeds.Contains(seed)) throw new ArenaInputException($"--seeds names seed {seed} twice; each seed counts once", "--seeds");
            seeds.Add(seed);
        }
        if (seeds.Count > MaxSeeds) throw new ArenaInputException($"--seeds lists {seeds.Count} seeds; at most {MaxSeeds}", "--seeds");
        return seeds;
    }
}
