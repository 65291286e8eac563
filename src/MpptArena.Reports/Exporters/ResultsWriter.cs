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
    public static RunSummary Write(string folder, RunResult run, bool plots = true, TimeWindow? window = null)
    {
        var summary = SummaryBuilder.Build(run);
        File.WriteAllText(Path.Combine(folder, "summary.json"), SummaryJson.Serialize(summary));
        File.WriteAllText(Path.Combine(folder, "summary.md"), MarkdownReport.Render(summary));
        File.WriteAllText(Path.Combine(folder, "pv-curves.json"), CurveSnapshotsJson.Serialize(run.Snapshots));
        var timing = new
        {
            note = "machine dependent; not part of the deterministic summary",
            wall_time_s = run.WallTimeS,
            simulated_per_wall = run.WallTimeS > 0 ? run.DurationS * run.Trackers.Count / run.WallTimeS : 0,
            trackers = run.Trackers.Select(t => new { name = t.Name, mean_compute_ns_per_call = t.MeanComputeNs, calls = t.TrackerCalls }),
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
