namespace MpptArena.Reports.Comparison;

/// <summary>How much worse a score may get before it counts as a regression: max(absolute, relative * |baseline|).</summary>
/// <param name="Absolute">Absolute allowance, in the score's unit.</param>
/// <param name="Relative">Allowance relative to the baseline value [-].</param>
public readonly record struct Tolerance(double Absolute, double Relative)
{
    /// <summary>Allowed worsening [score unit] against <paramref name="baseline"/>.</summary>
    public double AllowanceFor(double baseline) => Math.Max(Absolute, Relative * Math.Abs(baseline));
}
