using MpptArena.Numerics;

namespace MpptArena.Sweeps;

/// <summary>The values one swept quantity takes: a list, a linear range with a step, or a logarithmic range.</summary>
/// <param name="Name">Parameter name, or "period_ms" for the sample period.</param>
/// <param name="Values">Grid values, ascending.</param>
/// <param name="Min">Lowest value (for random and Latin-hypercube sampling).</param>
/// <param name="Max">Highest value.</param>
/// <param name="Logarithmic">True to sample in log space.</param>
public sealed record SweepAxis(string Name, IReadOnlyList<double> Values, double Min, double Max, bool Logarithmic)
{
    /// <summary>True when the values are a set of choices (a list, or a sample period): sampling picks one of them instead of drawing from the range.</summary>
    public bool IsChoice { get; init; }

    /// <summary>The value at a unit-interval coordinate u in [0, 1] (for sampling): one of the choices, or a point of the range.</summary>
    public double At(double u) => IsChoice ? Values[Math.Min(Values.Count - 1, (int)(u * Values.Count))] : Logarithmic ? PortableMath.Exp(PortableMath.Log(Min) + u * (PortableMath.Log(Max) - PortableMath.Log(Min))) : Min + u * (Max - Min);
}
