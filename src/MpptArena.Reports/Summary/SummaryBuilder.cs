using MpptArena.Runs;

namespace MpptArena.Reports.Summary;

/// <summary>Turns a <see cref="RunResult"/> into the summary document.</summary>
public static class SummaryBuilder
{
    /// <summary>Version of the tool, from the assembly.</summary>
    public static string ToolVersion => ArenaVersion.Release;

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
