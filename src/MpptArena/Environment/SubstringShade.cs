namespace MpptArena.Environment;

/// <summary>A fixed set of substrings whose transmitted share of light follows a profile (a leaf, a chimney shadow, soiling).</summary>
/// <param name="SubstringIndices">Flat substring indices affected.</param>
/// <param name="Transmittance">Share of light that reaches them over time [-], 0..1.</param>
public sealed record SubstringShade(IReadOnlyList<int> SubstringIndices, PiecewiseLinearProfile Transmittance) : IShading
{
    /// <inheritdoc/>
    public void Apply(double timeS, double[] factors)
    {
        double f = Transmittance.ValueAt(timeS);
        foreach (int k in SubstringIndices) factors[k] *= f;
    }
}
