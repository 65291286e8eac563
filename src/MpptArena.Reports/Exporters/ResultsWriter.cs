using System.Globalization;
using System.Text.Json;
using MpptArena.Reports.Plots;
using MpptArena.Reports.Summary;
using MpptArena.Runs;

namespace MpptArena.Reports.Exporters;

/// <summary>
/// Writes a results folder from a finished run: summary.json, summary.md, timing.json, pv-curves.json
/// and the plots. The series CSVs are streamed during the run by <see cref="CsvSeriesSink"/>.
/// </summary>
public static class ResultsWriter
{
    /// <summary>File name of a tracker's series CSV.</summary>
    public static string SeriesFileName(string trackerName) => $"series-{trackerName}.csv";

    /// <summary>Writes everything but the series; returns the summary.</summary>
    /// <param name="folder">Results folder (exists).</param>
    /// <param name="run">The run.</param>
    /// <param name="plots">Whether to draw PNG plots.</param>
    /// <param name="window">Part of the run the time-series plots show; null for all of it.</param>
    public static RunSummary Write(string folder, RunResult run, bool plots = true, TimeWindow? window = null) => Write(folder, [run], plots, window);

    /// <summary>Writes everything but the series for a run over one or more seeds (in seed order); returns the
    /// summary. Series, curve snapshots and plots of time are of the first seed.</summary>
    /// <param name="folder">Results folder (exists).</param>
    /// <param name="runs">One run per seed.</param>
    /// <param name="plots">Whether to draw PNG plots.</param>
    /// <param name="window">Part of the run the time-series plots show; null for all of it.</param>
    public static RunSummary Write(string folder, IReadOnlyList<RunResult> runs, bool plots = true, TimeWindow? window = null)
    {
        var run = runs[0];
        var summary = SummaryBuilder.Build(runs);
        double wallS = runs.Sum(r => r.WallTimeS);
        File.WriteAllText(Path.Combine(folder, "summary.json"), SummaryJson.Serialize(summary));
        File.WriteAllText(Path.Combine(folder, "summary.md"), MarkdownReport.Render(summary));
        File.WriteAllText(Path.Combine(folder, "pv-curves.json"), CurveSnapshotsJson.Serialize(run.Snapshots));
        var timing = new
        {
            note = "machine dependent; not part of the deterministic summary",
            wall_time_s = wallS,
            simulated_per_wall = wallS > 0 ? runs.Count * run.DurationS * run.Trackers.Count / wallS : 0,
            trackers = run.Trackers.Select((t, k) => new { name = t.Name, mean_compute_ns_per_call = runs.Average(r => r.Trackers[k].MeanComputeNs), calls = runs.Sum(r => r.Trackers[k].TrackerCalls) }),
        };
        File.WriteAllText(Path.Combine(folder, "timing.json"), JsonSerializer.Serialize(timing, new JsonSerializerOptions { WriteIndented = true }) + "\n");
        if (plots)
        {
            var series = new Dictionary<string, IReadOnlyList<SeriesRow>>();
            foreach (var t in run.Trackers)
            {
                string file = Path.Combine(folder, SeriesFileName(t.Name));
                if (File.Exists(file)) series[t.Name] = CsvSeriesSink.Read(file);
            }
            PlotWriter.WriteAll(folder, run, summary, series, window: window);
        }
        return summary;
    }

    /// <summary>Default results folder name: scenario name and a UTC timestamp.</summary>
    public static string DefaultFolderName(string scenario, DateTime utcNow) =>
        $"{scenario}-{utcNow.ToString("yyyyMMdd-HHmmss", CultureInfo.InvariantCulture)}";
}
