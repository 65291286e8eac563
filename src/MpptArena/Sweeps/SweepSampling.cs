namespace MpptArena.Sweeps;

/// <summary>How the parameter space is covered.</summary>
public enum SweepSamplingMethod
{
    /// <summary>Every combination of the axes' values (cross product).</summary>
    Grid,

    /// <summary>Independent uniform samples in each axis's range.</summary>
    Random,

    /// <summary>Latin-hypercube samples: each axis's range cut into N strata, each stratum used once.</summary>
    LatinHypercube,
}

/// <summary>Sampling settings.</summary>
/// <param name="Method">Method.</param>
/// <param name="Count">Samples per tracker for random and Latin-hypercube sampling.</param>
/// <param name="Seed">Seed of the sampling.</param>
public sealed record SweepSampling(SweepSamplingMethod Method, int Count = 0, ulong Seed = 1);
