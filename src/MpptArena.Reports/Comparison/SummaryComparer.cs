using MpptArena.Reports.Summary;
using MpptArena.Statistics;

namespace MpptArena.Reports.Comparison;

/// <summary>Compares a current summary with a baseline, tracker by tracker and score by score.</summary>
public static class SummaryComparer
{
    /// <summary>
    /// Every score change. A tracker that vanished or failed now is missing; one that failed in both is still
    /// failing; a score that became undefined regressed.
    /// </summary>
    public static IReadOnlyList<ScoreChange> Compare(RunSummary baseline, RunSummary current, ToleranceSet tolerances)
    {
        if (baseline.Scenario.Name != current.Scenario.Name)
        {
            throw new ArenaInputException($"the summaries are of different scenarios: baseline '{baseline.Scenario.Name}', current '{current.Scenario.Name}'", "scenario");
        }
        string scenario = current.Scenario.Name;
        var changes = new List<ScoreChange>();
        foreach (var b in baseline.Trackers)
        {
            var c = current.Trackers.FirstOrDefault(t => t.Name == b.Name);
            if (c is null)
            {
                changes.Add(new ScoreChange(scenario, b.Name, "tracker", null, null, 0, ScoreVerdict.Missing) { Note = "in the baseline, missing in current" });
                continue;
            }
            if (c.Failed)
            {
                var verdict = b.Failed ? ScoreVerdict.Failing : ScoreVerdict.Missing;
                string note = b.Failed ? $"failed in the baseline and fails in current: {c.FailureReason}" : $"ran in the baseline, failed in current: {c.FailureReason}";
                changes.Add(new ScoreChange(scenario, b.Name, "tracker", null, null, 0, verdict) { Note = note });
                continue;
            }
            foreach (var key in b.Scores.Keys.Union(c.Scores.Keys).OrderBy(k => k, StringComparer.Ordinal))
            {
                double? bv = b.Scores.GetValueOrDefault(key), cv = c.Scores.GetValueOrDefault(key);
                var info = ScoreCatalog.Find(key);
                var direction = info?.Direction ?? ScoreDirection.Neutral;
                double allowance = bv is { } bb ? tolerances.For(key).AllowanceFor(bb) : 0;
                if (Paired(b, c, key) is { } paired && direction != ScoreDirection.Neutral)
                {
                    double pairedAllowance = tolerances.For(key).AllowanceFor(paired.BaselineMean);
                    changes.Add(new ScoreChange(scenario, b.Name, key, paired.BaselineMean, paired.BaselineMean + paired.Differences.Mean, pairedAllowance,
                        JudgePaired(direction, paired.Differences, pairedAllowance)) { Paired = paired.Differences });
                    continue;
                }
                changes.Add(new ScoreChange(scenario, b.Name, key, bv, cv, allowance, Judge(direction, bv, cv, allowance, b.Scores.ContainsKey(key), c.Scores.ContainsKey(key))));
            }
        }
        foreach (var c in current.Trackers.Where(c => baseline.Trackers.All(b => b.Name != c.Name)))
        {
            changes.Add(c.Failed
                ? new ScoreChange(scenario, c.Name, "tracker", null, null, 0, ScoreVerdict.Failing) { Note = $"new in current, and failed: {c.FailureReason}" }
                : new ScoreChange(scenario, c.Name, "tracker", null, null, 0, ScoreVerdict.New) { Note = "new in current" });
        }
        return changes;
    }

    /// <summary>
    /// The seed-by-seed differences of one score over the seeds both summaries ran, when there are at least two
    /// and the score is defined for every one of them in both; null otherwise (the means are compared instead).
    /// </summary>
    private static (double BaselineMean, SampleSummary Differences)? Paired(TrackerSummary b, TrackerSummary c, string key)
    {
        if (b.PerSeed is null || c.PerSeed is null) return null;
        var common = b.PerSeed.Join(c.PerSeed, x => x.Seed, y => y.Seed, (x, y) => (B: x.Scores.GetValueOrDefault(key), C: y.Scores.GetValueOrDefault(key)))
            .ToList();
        if (common.Count < 2 || common.Any(p => p.B is null || p.C is null)) return null;
        var baseline = common.Select(p => p.B!.Value).ToList();
        return (baseline.Average(), SampleSummary.OfDifferences(baseline, common.Select(p => p.C!.Value).ToList()));
    }

    /// <summary>
    /// Paired verdict: worse (or better) only when the mean difference passes the allowance and its 95 %
    /// confidence interval lies wholly on that side of zero, so the noise of a few seeds cannot fail a gate.
    /// </summary>
    private static ScoreVerdict JudgePaired(ScoreDirection direction, SampleSummary d, double allowance)
    {
        double sign = direction == ScoreDirection.HigherIsBetter ? 1 : -1;
        double better = sign * d.Mean;
        double lo = sign * (sign > 0 ? d.ConfidenceLow!.Value : d.ConfidenceHigh!.Value);
        double hi = sign * (sign > 0 ? d.ConfidenceHigh!.Value : d.ConfidenceLow!.Value);
        if (better < -allowance && hi < 0) return ScoreVerdict.Regressed;
        if (better > allowance && better > 0 && lo > 0) return ScoreVerdict.Improved;
        return ScoreVerdict.Unchanged;
    }

    private static ScoreVerdict Judge(ScoreDirection direction, double? b, double? c, double allowance, bool inBaseline, bool inCurrent)
    {
        if (!inBaseline) return ScoreVerdict.New;
        if (!inCurrent) return direction == ScoreDirection.Neutral ? ScoreVerdict.Unchanged : ScoreVerdict.Missing;
        if (direction == ScoreDirection.Neutral) return ScoreVerdict.Unchanged;
        if (b is null && c is null) return ScoreVerdict.Unchanged;
        // A score that became undefined is a regression: an undefined time means "never settled", an undefined
        // efficiency means there was nothing to measure it on any more; one that became defined is an improvement.
        if (b is null) return ScoreVerdict.Improved;
        if (c is null) return ScoreVerdict.Regressed;
        double better = direction == ScoreDirection.HigherIsBetter ? c.Value - b.Value : b.Value - c.Value;
        if (better < -allowance) return ScoreVerdict.Regressed;
        if (better > allowance && better > 0) return ScoreVerdict.Improved;
        return ScoreVerdict.Unchanged;
    }
}
