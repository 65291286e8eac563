namespace MpptArena.Sensing;

/// <summary>
/// A seeded pseudo-random generator whose sequence is fixed by this code alone (not by the runtime's
/// generator), so that a seed gives the same noise on every machine and .NET version.
/// </summary>
/// <remarks>xoshiro256** by D. Blackman, S. Vigna, "Scrambled linear pseudorandom number generators",
/// ACM TOMS 47(4), 2021; seeded through SplitMix64 as the authors recommend. Normal deviates by the
/// Marsaglia polar method (G. Marsaglia, T. A. Bray, SIAM Review 6(3), 1964).</remarks>
public sealed class DeterministicRandom
{
    private ulong _s0, _s1, _s2, _s3;
    private double _spare;
    private bool _hasSpare;

    /// <summary>A generator for <paramref name="seed"/>.</summary>
    public DeterministicRandom(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix(ref x); _s1 = SplitMix(ref x); _s2 = SplitMix(ref x); _s3 = SplitMix(ref x);
    }

    private static ulong SplitMix(ref ulong x)
    {
        ulong z = x += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Next 64 random bits.</summary>
    public ulong NextUInt64()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0; _s3 ^= _s1; _s1 ^= _s2; _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Standard normal deviate.</summary>
    public double NextGaussian()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare;
        }
        double u, v, s;
        do
        {
            u = 2.0 * NextDouble() - 1.0;
            v = 2.0 * NextDouble() - 1.0;
            s = u * u + v * v;
        } while (s >= 1.0 || s == 0.0);
        double m = Math.Sqrt(-2.0 * Math.Log(s) / s);
        _spare = v * m;
        _hasSpare = true;
        return u * m;
    }

    /// <summary>A seed for an independent stream derived from this seed and a stream number.</summary>
    public static ulong Derive(ulong seed, ulong stream)
    {
        ulong x = seed ^ (stream * 0xD1B54A32D192ED03UL);
        return SplitMix(ref x);
    }
}
