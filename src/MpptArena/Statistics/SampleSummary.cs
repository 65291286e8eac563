namespace MpptArena.Statistics;

/// <summary>
/// Mean, spread and a confidence interval of the mean for values drawn independently, one per seed: the
/// textbook Student t interval, mean +/- t(coverage, n - 1) s / sqrt(n) with s the sample standard deviation.
/// </summary>
/// <remarks>W. S. Gosset ("Student"), "The probable error of a mean", Biometrika 6(1), 1908; the interval as in
/// NIST/SEMATECH e-Handbook of Statistical Methods, sec. 7.2.2. Sums run in the order given, so the same values
/// give the same bits everywhere.</remarks>
/// <param name="Count">Number of values n.</param>
/// <param name="Mean">Arithmetic mean [unit of the values].</param>
/// <param name="StandardDeviation">Sample standard deviation (n - 1 in the denominator); null for one value.</param>
/// <param name="Min">Smallest value.</param>
/// <param name="Max">Largest value.</param>
/// <param name="ConfidenceLow">Lower end of the confidence interval of the mean; null for one value.</param>
/// <param name="ConfidenceHigh">Upper end; null for one value.</param>
public sealed record SampleSummary(int Count, double Mean, double? StandardDeviation, double Min, double Max, double? ConfidenceLow, double? ConfidenceHigh)
{
    /// <summary>Two-sided coverage of the intervals reported [-].</summary>
    public const double Coverage = 0.95;

    /// <summary>The summary of <paramref name="values"/> (at least one, all finite).</summary>
    public static SampleSummary Of(IReadOnlyList<double> values)
    {
        ArgumentOutOfRangeException.ThrowIfZero(values.Count);
        int n = values.Count;
        double sum = 0, min = double.PositiveInfinity, max = double.NegativeInfinity;
        foreach (double v in values)
        {
            sum += v;
            min = Math.Min(min, v);
            max = Math.Max(max, v);
        }
        double mean = sum / n;
        if (n == 1) return new SampleSummary(1, mean, null, min, max, null, null);
        double squares = 0;
        foreach (double v in values) squares += (v - mean) * (v - mean);
        double sd = Math.Sqrt(squares / (n - 1));
        double half = StudentT.TwoSidedQuantile(Coverage, n - 1) * sd / Math.Sqrt(n);
        return new SampleSummary(n, mean, sd, min, max, mean - half, mean + half);
    }

    /// <summary>Half the width of the confidence interval; null for one value.</summary>
    public double? HalfWidth => ConfidenceHigh is { } hi && ConfidenceLow is { } lo ? 0.5 * (hi - lo) : null;

    /// <summary>True when the confidence interval holds zero (or there is none): a mean difference not told apart from no difference.</summary>
    public bool IntervalHoldsZero => ConfidenceLow is not { } lo || ConfidenceHigh is not { } hi || (lo <= 0 && hi >= 0);

    /// <summary>
    /// Seed-by-seed differences <paramref name="current"/>[k] - <paramref name="baseline"/>[k]: the paired comparison,
    /// in which noise common to both (the same seed, the same sensor noise) cancels.
    /// </summary>
    public static SampleSummary OfDifferences(IReadOnlyList<double> baseline, IReadOnlyList<double> current)
    {
        if (baseline.Count != current.Count) throw new ArgumentException("paired samples must have the same length", nameof(current));
        var d = new double[baseline.Count];
        for (int k = 0; k < d.Length; k++) d[k] = current[k] - baseline[k];
        return Of(d);
    }
}
