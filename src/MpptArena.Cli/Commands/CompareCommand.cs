using MpptArena.Cli.Terminal;
using System.Globalization;
using MpptArena.Reports.Comparison;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Summary;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena compare BASELINE CURRENT: the regression gate. Exit 0 nothing regressed, 1 something did, 2 bad input.</summary>
internal static class CompareCommand
{
    public const string Usage = "mppt-arena compare BASELINE CURRENT [--tolerances FILE.yaml] [--tolerance SCORE=ABS[,REL]]... [--junit FILE] [--all]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "compare", ["--tolerances", "--tolerance", "--junit"], ["--all"]);
        a.RequirePositional(2, Usage);
        var tolerances = new ToleranceSet();
        if (a.Option("--tolerances") is { } file) tolerances.LoadYaml(file);
        foreach (string t in a.Options("--tolerance")) tolerances.ParseOption(t);
        var baseline = SummaryJson.Read(a.Positional[0]);
        var current = SummaryJson.Read(a.Positional[1]);
        var changes = SummaryComparer.Compare(baseline, current, tolerances);

        var c = CultureInfo.InvariantCulture;
        string Num(double? v) => v is { } x ? x.ToString("G6", c) : "undefined";
        foreach (var ch in changes.Where(ch => a.Flag("--all") || ch.Verdict != ScoreVerdict.Unchanged))
        {
            string delta = ch.Delta is { } d ? $" ({(d >= 0 ? "+" : "")}{d.ToString("G4", c)}, allowed {ch.Allowance.ToString("G3", c)})" : "";
            if (ch.Paired is { ConfidenceLow: { } lo, ConfidenceHigh: { } hi } p)
            {
                delta = $" (paired over {p.Count} seeds: {(p.Mean >= 0 ? "+" : "")}{p.Mean.ToString("G4", c)}, 95 % interval [{lo.ToString("G4", c)}, {hi.ToString("G4", c)}], allowed {ch.Allowance.ToString("G3", c)})";
            }
            string line = ch.Note is { } note ? $"{ch.Tracker}: {note}" : $"{ch.Tracker}.{ch.Score}: {Num(ch.Baseline)} -> {Num(ch.Current)}{delta}";
            StandardOutput.Out.WriteLine($"{ch.Verdict.ToString().ToLowerInvariant(),-10} {line}");
        }
        int regressions = changes.Count(ch => ch.IsRegression);
        if (regressions == 0 && changes.Count == 0) throw new ArenaInputException("the summaries hold no trackers to compare", "arguments");
        int improvements = changes.Count(ch => ch.Verdict == ScoreVerdict.Improved);
        StandardOutput.Out.WriteLine($"{current.Scenario.Name}: {regressions} regressed, {improvements} improved, {changes.Count(ch => ch.Verdict == ScoreVerdict.Unchanged)} within tolerance");
        if (baseline.Scenario.PlantDigest != current.Scenario.PlantDigest)
        {
            StandardOutput.Out.WriteLine($"note: the plants differ (digest {baseline.Scenario.PlantDigest} in the baseline, {current.Scenario.PlantDigest} in current); scores are not strictly comparable");
        }
        var baseSeeds = baseline.Scenario.Seeds ?? [baseline.Scenario.Seed];
        var currentSeeds = current.Scenario.Seeds ?? [current.Scenario.Seed];
        int common = baseSeeds.Intersect(currentSeeds).Count();
        if (baseSeeds.Count > 1 || currentSeeds.Count > 1)
        {
            StandardOutput.Out.WriteLine(common >= 2
                ? $"paired by seed: {common} seeds in both; a change counts only when its 95 % interval excludes zero"
                : $"note: the summaries share {common} seed(s); means over seeds are compared unpaired, without a test for noise");
        }
        else if (baseline.Scenario.Seed != current.Scenario.Seed)
        {
            StandardOutput.Out.WriteLine($"note: the seeds differ ({baseline.Scenario.Seed} in the baseline, {current.Scenario.Seed} in current); noise-driven scores may move");
        }
        if (baseline.ToolVersion != current.ToolVersion)
        {
            StandardOutput.Out.WriteLine($"note: the summaries come from different tool versions ({baseline.ToolVersion} and {current.ToolVersion})");
        }
        if (a.Option("--junit") is { } junit)
        {
            JUnitWriter.Write(junit, changes.Where(ch => ch.Verdict != ScoreVerdict.New).Select(ch => new JUnitCase(
                ch.Scenario, $"{ch.Tracker}.{ch.Score}", ch.IsRegression ? ch.Note ?? $"{ch.Verdict}: {Num(ch.Baseline)} -> {Num(ch.Current)}" : null,
                $"baseline {Num(ch.Baseline)}, current {Num(ch.Current)}, allowed worsening {ch.Allowance.ToString("G3", c)}"
                + (ch.Paired is { ConfidenceLow: { } lo, ConfidenceHigh: { } hi } p ? $", paired over {p.Count} seeds, 95 % interval of the difference [{lo.ToString("G4", c)}, {hi.ToString("G4", c)}]" : ""))));
        }
        return regressions > 0 ? ExitCodes.GateFailed : ExitCodes.Ok;
    }
}
