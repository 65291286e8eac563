using System.Globalization;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Summary;

namespace MpptArena.Cli.Commands;

/// <summary>Thresholds from --fail-below / --fail-above: "score=value" for every tracker or "tracker:score=value" for one.</summary>
internal sealed class Gate
{
    private readonly List<(string? Tracker, string Score, double Value, bool Below)> _rules = [];

    public static Gate ParseAll(IEnumerable<string> below, IEnumerable<string> above)
    {
        var g = new Gate();
        foreach (string b in below) g.Add(b, true);
        foreach (string b in above) g.Add(b, false);
        return g;
    }

    private void Add(string text, bool below)
    {
        string option = below ? "--fail-below" : "--fail-above";
        int eq = text.LastIndexOf('=');
        if (eq <= 0) throw new ArenaInputException($"{option} '{text}' must look like score=value or tracker:score=value", option);
        string left = text[..eq];
        string? tracker = null;
        int colon = left.IndexOf(':');
        if (colon > 0 && !left.StartsWith(ScoreCatalog.WindowPrefix, StringComparison.Ordinal))
        {
            tracker = left[..colon];
            left = left[(colon + 1)..];
        }
        if (ScoreCatalog.Find(left) is null) throw new ArenaInputException($"{option}: unknown score '{left}'; known: {string.Join(", ", ScoreCatalog.All.Select(s => s.Key))}, window:NAME", option);
        if (!double.TryParse(text[(eq + 1)..], NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
            throw new ArenaInputException($"{option} '{text}': '{text[(eq + 1)..]}' is not a finite number", option);
        _rules.Add((tracker, left, v, below));
    }

    /// <summary>
    /// Refuses, before the run, a rule naming a tracker the run does not have or a window the scenario does
    /// not score.
    /// </summary>
    public void CheckAgainst(IReadOnlyCollection<string> trackers, IReadOnlyCollection<string> windows)
    {
        foreach (var r in _rules)
        {
            string option = r.Below ? "--fail-below" : "--fail-above";
            if (r.Tracker is not null && !trackers.Contains(r.Tracker))
            {
                throw new ArenaInputException($"{option} names tracker '{r.Tracker}', which is not in the run; it has: {string.Join(", ", trackers)}", option);
            }
            if (r.Score.StartsWith(ScoreCatalog.WindowPrefix, StringComparison.Ordinal) && !windows.Contains(r.Score[ScoreCatalog.WindowPrefix.Length..]))
            {
                string known = windows.Count == 0 ? "the scenario scores no windows" : "it scores: " + string.Join(", ", windows);
                throw new ArenaInputException($"{option}: the scenario has no window '{r.Score[ScoreCatalog.WindowPrefix.Length..]}'; {known}", option);
            }
        }
    }

    /// <summary>One case per tracker per rule, plus one per tracker for "did not fail".</summary>
    public IReadOnlyList<JUnitCase> Check(RunSummary s)
    {
        var cases = new List<JUnitCase>();
        var c = CultureInfo.InvariantCulture;
        foreach (var t in s.Trackers)
        {
            cases.Add(new JUnitCase(s.Scenario.Name, $"{t.Name}.ran", t.Failed ? $"tracker failed at {t.FailureTimeS} s: {t.FailureReason}" : null,
                t.Failed ? "failed" : $"tracking_efficiency = {t.Scores.GetValueOrDefault("tracking_efficiency")?.ToString("0.000000", c)}"));
            if (t.Failed) continue;
            foreach (var r in _rules.Where(r => r.Tracker is null || r.Tracker == t.Name))
            {
                double? v = t.Scores.GetValueOrDefault(r.Score);
                string? failure = v is null ? $"{r.Score} is undefined"
                    : r.Below && v < r.Value ? $"{r.Score} = {v.Value.ToString("G6", c)} is below {r.Value.ToString("G6", c)}"
                    : !r.Below && v > r.Value ? $"{r.Score} = {v.Value.ToString("G6", c)} is above {r.Value.ToString("G6", c)}"
                    : null;
                cases.Add(new JUnitCase(s.Scenario.Name, $"{t.Name}.{r.Score}", failure, $"{r.Score} = {v?.ToString("G6", c) ?? "undefined"}"));
            }
        }
        return cases;
    }
}
