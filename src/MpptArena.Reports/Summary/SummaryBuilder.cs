using MpptArena.Runs;
using MpptArena.Statistics;

namespace MpptArena.Reports.Summary;

/// <summary>Turns a <see cref="RunResult"/> into the summary document.</summary>
public static class SummaryBuilder
{
    /// <summary>Version of the tool, from the assembly.</summary>
    public static string ToolVersion => ArenaVersion.Release;

    /// <summary>The summary of a run over one seed or several (one <see cref="RunResult"/> per seed, in seed order).</summary>
    public static RunSummary Build(IReadOnlyList<RunResult> runs)
    {
        if (runs.Count == 1) return Build(runs[0]);
        var perSeed = runs.Select(Build).ToList();
        var first = perSeed[0];
        var trackers = first.Trackers.Select((t, k) => Combine(perSeed.Select(s => s.Trackers[k]).ToList(), runs.Select(r => r.Seed).ToList())).ToList();
        var ranking = Rank(trackers);
        return first with
        {
            Scenario = first.Scenario with { Seeds = runs.Select(r => r.Seed).ToList() },
            Trackers = trackers,
            Ranking = ranking,
            Indistinguishable = Indistinguishable(ranking, trackers),
        };
    }

    /// <summary>One tracker over every seed: the first failure, or the mean, statistics and per-seed scores.</summary>
    private static TrackerSummary Combine(IReadOnlyList<TrackerSummary> bySeed, IReadOnlyList<ulong> seeds)
    {
        int failed = bySeed.ToList().FindIndex(t => t.Failed);
        if (failed >= 0) return bySeed[failed] with { FailureSeed = seeds[failed], FailureReason = $"with seed {seeds[failed]}: {bySeed[failed].FailureReason}" };
        var keys = bySeed.SelectMany(t => t.Scores.Keys).Distinct().Order(StringComparer.Ordinal).ToList();
        var scores = new SortedDictionary<string, double?>(StringComparer.Ordinal);
        var statistics = new SortedDictionary<string, ScoreStatistics>(StringComparer.Ordinal);
        foreach (string key in keys)
        {
            var defined = bySeed.Select(t => t.Scores.GetValueOrDefault(key)).OfType<double>().ToList();
            if (defined.Count == 0)
            {
                scores[key] = null;
                continue;
            }
            var sample = SampleSummary.Of(defined);
            scores[key] = defined.Count == bySeed.Count ? sample.Mean : null;
            statistics[key] = new ScoreStatistics(defined.Count, bySeed.Count - defined.Count, sample.Mean, sample.StandardDeviation, sample.Min, sample.Max, sample.ConfidenceLow, sample.ConfidenceHigh);
        }
        var firstSeed = bySeed[0];
        return firstSeed with
        {
            Scores = scores,
            Statistics = statistics,
            PerSeed = bySeed.Select((t, k) => new SeedScores(seeds[k], t.Scores)).ToList(),
            TrackerCalls = bySeed.Sum(t => t.TrackerCalls),
            EnergySplit = bySeed.All(t => t.EnergySplit is not null) ? MeanSplit(bySeed.Select(t => t.EnergySplit!).ToList()) : null,
            Stall = bySeed.All(t => t.Stall is not null)
                ? new StallEntry(bySeed.Any(t => t.Stall!.Stalled), bySeed.Average(t => t.Stall!.StallTimeS), bySeed.Select(t => t.Stall!.FirstStallS).Where(x => x is not null).Min(),
                    bySeed.Average(t => t.Stall!.StallEnergyLostWh))
                : null,
            DiscontinuousConductionShare = bySeed.All(t => t.DiscontinuousConductionShare is not null) ? bySeed.Average(t => t.DiscontinuousConductionShare!.Value) : null,
            Windows = firstSeed.Windows.Select((w, j) => w with
            {
                EnergyWh = bySeed.Average(t => t.Windows[j].EnergyWh),
                AvailableWh = bySeed.Average(t => t.Windows[j].AvailableWh),
                Efficiency = bySeed.All(t => t.Windows[j].Efficiency is not null) ? bySeed.Average(t => t.Windows[j].Efficiency!.Value) : null,
            }).ToList(),
        };
    }

    private static EnergySplitEntry MeanSplit(IReadOnlyList<EnergySplitEntry> s) => new(
        s.Average(x => x.StartupWh), s.Average(x => x.AfterEventsWh), s.Average(x => x.SteadyStateWh), s.Average(x => x.LowerHillWh),
        s.Average(x => x.ExcursionsWh), s.Average(x => x.AfterFailureWh), s.Average(x => x.TotalWh));

    /// <summary>Pairs of ranked trackers whose seed-by-seed efficiency difference has a confidence interval that holds zero.</summary>
    public static IReadOnlyList<TrackerPair> Indistinguishable(IReadOnlyList<string> ranking, IReadOnlyList<TrackerSummary> trackers)
    {
        const string key = "tracking_efficiency";
        var ranked = ranking.Select(n => trackers.First(t => t.Name == n)).Where(t => !t.Failed && t.PerSeed is not null).ToList();
        var pairs = new List<TrackerPair>();
        for (int i = 0; i < ranked.Count; i++)
        for (int j = i + 1; j < ranked.Count; j++)
        {
            var a = ranked[i].PerSeed!.Select(p => p.Scores.GetValueOrDefault(key) ?? double.NaN).ToList();
            var b = ranked[j].PerSeed!.Select(p => p.Scores.GetValueOrDefault(key) ?? double.NaN).ToList();
            if (a.Any(double.IsNaN) || b.Any(double.IsNaN)) continue;
            var d = SampleSummary.OfDifferences(b, a);
            if (d.IntervalHoldsZero) pairs.Add(new TrackerPair(ranked[i].Name, ranked[j].Name, d.Mean, d.ConfidenceLow, d.ConfidenceHigh));
        }
        return pairs;
    }

    /// <summary>The summary of a run.</summary>
    public static RunSummary Build(RunResult run)
    {
        var trackers = run.Trackers.Select(t => new TrackerSummary
        {
            Name = t.Name,
            Kind = t.Kind,
            SamplePeriodS = t.SamplePeriodS,
            Parameters = new SortedDictionary<string, double>(t.Parameters.ToDictionary(kv => kv.Key, kv => kv.Value), StringComparer.Ordinal),
            Failed = t.Failure is not null,
            FailureReason = t.Failure?.Reason,
            FailureTimeS = t.Failure?.TimeS,
            FailureRecentCalls = t.Failure?.Recent.Select(r => new RecentCall(r.TimeS, r.VoltageV, r.CurrentA, double.IsFinite(r.Command) ? r.Command : null)).ToList(),
            TrackerCalls = t.TrackerCalls,
            DiscontinuousConductionShare = t.DiscontinuousTimeS is { } dcm && run.DurationS > 0
                ? Math.Min(1.0, dcm / (t.Failure is { } f ? Math.Max(f.TimeS, run.PlantStepS) : run.DurationS)) : null,
            Scores = t.Scores is null ? new SortedDictionary<string, double?>(StringComparer.Ordinal) : ScoreCatalog.ToDictionary(t.Scores),
            EnergySplit = t.EnergySplit is { } split ? EnergySplitEntry.Of(split) : null,
            Stall = t.Stall is { } stall ? new StallEntry(stall.Stalled, stall.StallTimeS, stall.FirstStallS, stall.StallEnergyLostWh) : null,
            Settling = t.Scores?.Settling.Select(s => new SettlingEntry(s.EventS, s.Label, s.SettlingTimeS)).ToList() ?? [],
            Windows = t.Scores is null ? [] : t.Scores.Windows.Concat(t.Scores.Groups)
                .Select(w => new WindowEntry(w.Name, w.StartS, w.EndS, w.SlopeWm2PerS, w.EnergyWh, w.AvailableWh, w.Efficiency)).ToList(),
        }).ToList();
        return new RunSummary
        {
            Schema = RunSummary.SchemaId,
            ToolVersion = ToolVersion,
            Scenario = new ScenarioInfo
            {
                Name = run.ScenarioName,
                Description = run.Description,
                Seed = run.Seed,
                Seeds = [run.Seed],
                PlantDigest = run.PlantDigest,
                DurationS = run.DurationS,
                PlantStepS = run.PlantStepS,
                CurvePreparations = run.CurvePreparations,
            },
            Trackers = trackers,
            Ranking = Rank(trackers),
        };
    }

    /// <summary>Names by tracking efficiency, best first (ties by name); failed trackers last.</summary>
    public static IReadOnlyList<string> Rank(IEnumerable<TrackerSummary> trackers) =>
        trackers.OrderBy(t => t.Failed)
            .ThenByDescending(t => t.Scores.GetValueOrDefault("tracking_efficiency") ?? double.NegativeInfinity)
            .ThenBy(t => t.Name, StringComparer.Ordinal)
            .Select(t => t.Name).ToList();
}
