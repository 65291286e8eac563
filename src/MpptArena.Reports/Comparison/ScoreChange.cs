namespace MpptArena.Reports.Comparison;

/// <summary>One tracker x score compared.</summary>
/// <param name="Scenario">Scenario name.</param>
/// <param name="Tracker">Tracker name.</param>
/// <param name="Score">Score key.</param>
/// <param name="Baseline">Baseline value, null if undefined or absent.</param>
/// <param name="Current">Current value, null if undefined or absent.</param>
/// <param name="Allowance">Worsening allowed [score unit].</param>
/// <param name="Verdict">Outcome.</param>
public sealed record ScoreChange(string Scenario, string Tracker, string Score, double? Baseline, double? Current, double Allowance, ScoreVerdict Verdict)
{
    /// <summary>Current minus baseline, when both exist.</summary>
    public double? Delta => Baseline is { } b && Current is { } c ? c - b : null;

    /// <summary>What happened, in words, where the numbers do not say it (a tracker missing or failed).</summary>
    public string? Note { get; init; }

    /// <summary>
    /// The seed-by-seed comparison behind the verdict when both summaries hold the score for at least two common
    /// seeds: the summary of current minus baseline per seed; null when the means were compared.
    /// </summary>
    public Statistics.SampleSummary? Paired { get; init; }

    /// <summary>True if this change fails a gate.</summary>
    public bool IsRegression => Verdict is ScoreVerdict.Regressed or ScoreVerdict.Missing or ScoreVerdict.Failing;
}
