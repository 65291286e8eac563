using MpptArena.Reports.Summary;

namespace MpptArena.Reports.Comparison;

/// <summary>Compares a current summary with a baseline, tracker by tracker and score by score.</summary>
public static class SummaryComparer
{
    /// <summary>Every score change; a tracker that failed now, or vanished, is reported as missing.</summary>
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
            if (c is null || (c.Failed && !b.Failed))
            {
                string what = c is null ? "tracker" : "tracker (failed: " + c.FailureReason + ")";
                changes.Add(new ScoreChange(scenario, b.Name, what, null, null, 0, ScoreVerdict.Missing));
                continue;
            }
            foreach (var key in b.Scores.Keys.Union(c.Scores.Keys).OrderBy(k => k, StringComparer.Ordinal))
            {
                double? bv = b.Scores.GetValueOrDefault(key), cv = c.Scores.GetValueOrDefault(key);
                var info = ScoreCatalog.Find(key);
                var direction = info?.Direction ?? ScoreDirection.Neutral;
                double allowance = bv is { } bb ? tolerances.For(key).AllowanceFor(bb) : 0;
                changes.Add(new ScoreChange(scenario, b.Name, key, bv, cv, allowance, Judge(direction, bv, cv, allowance, b.Scores.ContainsKey(key), c.Scores.ContainsKey(key))));
            }
        }
        foreach (var c in current.Trackers.Where(c => baseline.Trackers.All(b => b.Name != c.Name)))
        {
            changes.Add(new ScoreChange(scenario, c.Name, "tracker", null, null, 0, ScoreVerdict.New));
        }
        return changes;
    }

    private static ScoreVerdict Judge(ScoreDirection direction, double? b, double? c, double allowance, bool inBaseline, bool inCurrent)
    {
        if (!inBaseline) return ScoreVerdict.New;
        if (!inCurrent) return direction == ScoreDirection.Neutral ? ScoreVerdict.Unchanged : ScoreVerdict.Missing;
        if (direction == ScoreDirection.Neutral) return ScoreVerdict.Unchanged;
        if (b is null && c is null) return ScoreVerdict.Unchanged;
        // Undefined lower-is-better times mean "never settled": worse than any number.
        if (b is null) return direction == ScoreDirection.LowerIsBetter ? ScoreVerdict.Improved : ScoreVerdict.Unchanged;
        if (c is null) return direction == ScoreDirection.LowerIsBetter ? ScoreVerdict.Regressed : ScoreVerdict.Unchanged;
        double better = direction == ScoreDirection.HigherIsBetter ? c.Value - b.Value : b.Value - c.Value;
        if (better < -allowance) return ScoreVerdict.Regressed;
        if (better > allowance && better > 0) return ScoreVerdict.Improved;
        return ScoreVerdict.Unchanged;
    }
}
