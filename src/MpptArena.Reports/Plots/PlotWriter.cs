using MpptArena.Reports.Summary;
using MpptArena.Runs;
using ScottPlot;

namespace MpptArena.Reports.Plots;

/// <summary>
/// The PNG plots of a results folder. Reads the run result and the series CSVs; runs nothing.
/// Every axis is labelled with its unit; the default size is 1200 x 800. Each tracker keeps one colour
/// across every plot of a run (<see cref="TrackerPalette"/>), and legends sit outside the data, right of it.
/// </summary>
public static class PlotWriter
{
    /// <summary>Default width [px].</summary>
    public const int DefaultWidth = 1200;

    /// <summary>Default height [px].</summary>
    public const int DefaultHeight = 800;

    /// <summary>Writes every plot for a run into <paramref name="folder"/>; returns the files written.</summary>
    /// <param name="folder">Results folder.</param>
    /// <param name="run">The run.</param>
    /// <param name="summary">Its summary.</param>
    /// <param name="series">Series rows per tracker name (may be empty when series were not written).</param>
    /// <param name="width">Width [px].</param>
    /// <param name="height">Height [px].</param>
    /// <param name="window">Part of the run the power and voltage plots show; null for all of it.</param>
    public static IReadOnlyList<string> WriteAll(string folder, RunResult run, RunSummary summary,
        IReadOnlyDictionary<string, IReadOnlyList<SeriesRow>> series, int width = DefaultWidth, int height = DefaultHeight, TimeWindow? window = null)
    {
        var palette = new TrackerPalette(summary.Trackers.Select(t => t.Name));
        var files = new List<string>();
        if (series.Count > 0)
        {
            var shown = window is null ? series : series.ToDictionary(kv => kv.Key, kv => (IReadOnlyList<SeriesRow>)kv.Value.Where(r => window.Contains(r.TimeS)).ToList());
            files.Add(Save(Power(shown, palette, window), Path.Combine(folder, "power.png"), width, height));
            files.Add(Save(Voltage(shown, palette, window), Path.Combine(folder, "voltage.png"), width, height));
            foreach (var snap in run.Snapshots)
            {
                string name = $"pv-curve-{snap.TimeS.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)}s.png";
                files.Add(Save(Curve(snap, series, palette), Path.Combine(folder, name), width, height));
            }
        }
        files.Add(Save(EfficiencyBars(summary, palette), Path.Combine(folder, "efficiency.png"), width, height));
        if (summary.Trackers.Any(t => t.EnergySplit is not null))
        {
            files.Add(Save(EnergySplitBars(summary), Path.Combine(folder, "energy-split.png"), width, height));
        }
        if (summary.Trackers.Any(t => t.Windows.Any(w => w.SlopeWm2PerS is not null)))
        {
            files.Add(Save(RampEfficiency(summary, palette), Path.Combine(folder, "ramp-efficiency.png"), width, height));
        }
        return files;
    }

    private static string Save(Plot plot, string path, int width, int height)
    {
        plot.SavePng(path, width, height);
        return path;
    }

    /// <summary>Power of every tracker and the true MPP power against time.</summary>
    public static Plot Power(IReadOnlyDictionary<string, IReadOnlyList<SeriesRow>> series, TrackerPalette? palette = null, TimeWindow? window = null) =>
        AgainstMpp(series, r => r.PowerW, r => r.MppPowerW, "global MPP",
            "Array power and the power available at the global MPP", "power [W]", palette, window);

    /// <summary>Operating voltage of every tracker and the voltage of the global MPP against time.</summary>
    public static Plot Voltage(IReadOnlyDictionary<string, IReadOnlyList<SeriesRow>> series, TrackerPalette? palette = null, TimeWindow? window = null) =>
        AgainstMpp(series, r => r.VoltageV, r => r.MppVoltageV, "global MPP voltage",
            "Operating voltage against the voltage of the global MPP", "PV voltage [V]", palette, window);

    /// <summary>One quantity of every tracker against time, with the same quantity at the true MPP dashed in black.</summary>
    private static Plot AgainstMpp(IReadOnlyDictionary<string, IReadOnlyList<SeriesRow>> series, Func<SeriesRow, double> tracker,
        Func<SeriesRow, double> atMpp, string mppLegend, string title, string yLabel, TrackerPalette? palette, TimeWindow? window)
    {
        palette ??= new TrackerPalette(series.Keys);
        var plot = new Plot();
        var first = series.Values.First();
        var mpp = plot.Add.ScatterLine(first.Select(r => r.TimeS).ToArray(), first.Select(atMpp).ToArray());
        mpp.LegendText = mppLegend;
        mpp.Color = Colors.Black;
        mpp.LineWidth = 2;
        mpp.LinePattern = LinePattern.Dashed;
        foreach (var (name, rows) in series)
        {
            var line = plot.Add.ScatterLine(rows.Select(r => r.TimeS).ToArray(), rows.Select(tracker).ToArray());
            line.LegendText = name;
            line.LineWidth = 1.5f;
            line.Color = palette[name];
        }
        plot.Title(window is null ? title : $"{title}, {window}");
        plot.XLabel("time [s]");
        plot.YLabel(yLabel);
        if (window is not null) plot.Axes.SetLimitsX(window.StartS, window.EndS);
        plot.ShowLegend(Edge.Right);
        return plot;
    }

    /// <summary>The P-V curve at one instant, its maxima, and each tracker's operating points around that instant.</summary>
    public static Plot Curve(CurveSnapshot snap, IReadOnlyDictionary<string, IReadOnlyList<SeriesRow>> series, TrackerPalette? palette = null, double windowS = 0.5)
    {
        palette ??= new TrackerPalette(series.Keys);
        var plot = new Plot();
        var curve = plot.Add.ScatterLine(snap.VoltageV.ToArray(), snap.PowerW.ToArray());
        curve.LegendText = "P-V curve";
        curve.Color = Colors.Black;
        curve.LineWidth = 2;
        foreach (var p in snap.Peaks.Peaks)
        {
            plot.Add.Marker(p.VoltageV, p.PowerW, MarkerShape.OpenCircle, 14, Colors.Gray);
        }
        var g = plot.Add.Marker(snap.Peaks.Global.VoltageV, snap.Peaks.Global.PowerW, MarkerShape.FilledDiamond, 16, TrackerPalette.Mpp);
        g.LegendText = "global MPP (circles: local maxima)";
        foreach (var (name, rows) in series)
        {
            var near = rows.Where(r => Math.Abs(r.TimeS - snap.TimeS) <= windowS).ToList();
            if (near.Count == 0) continue;
            var pts = plot.Add.ScatterPoints(near.Select(r => r.VoltageV).ToArray(), near.Select(r => r.PowerW).ToArray());
            pts.LegendText = $"{name} (t = {snap.TimeS - windowS:0.##} to {snap.TimeS + windowS:0.##} s)";
            pts.MarkerSize = 6;
            pts.Color = palette[name];
        }
        plot.Title($"P-V curve at t = {snap.TimeS:0.###} s with each tracker's operating points");
        // The series rows are means over their output interval, so a dot may lie off the curve of the instant.
        plot.XLabel("PV voltage [V] (dots: each tracker's series rows, means over their output interval)");
        plot.YLabel("power [W]");
        plot.Axes.SetLimitsY(0, snap.Peaks.Global.PowerW * 1.15);
        plot.ShowLegend(Edge.Right);
        return plot;
    }

    /// <summary>Tracking efficiency per tracker as bars.</summary>
    public static Plot EfficiencyBars(RunSummary summary, TrackerPalette? palette = null)
    {
        palette ??= new TrackerPalette(summary.Trackers.Select(t => t.Name));
        var plot = new Plot();
        var names = summary.Trackers.Select(t => t.Name).ToArray();
        var values = summary.Trackers.Select(t => t.Scores.GetValueOrDefault("tracking_efficiency") ?? 0.0).ToArray();
        var bars = values.Select((v, i) => new Bar { Position = i, Value = v * 100, FillColor = palette[names[i]] }).ToList();
        plot.Add.Bars(bars);
        var ticks = names.Select((n, i) => new Tick(i, n)).ToArray();
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks);
        double low = Math.Max(0, Math.Floor(values.Where(v => v > 0).DefaultIfEmpty(0).Min() * 100 - 5));
        plot.Axes.SetLimitsY(low, 100.5);
        plot.Title($"Tracking efficiency, {summary.Scenario.Name}");
        plot.XLabel("tracker");
        // Differences of a point matter here, so the axis is zoomed; the label says where it starts.
        plot.YLabel(low > 0 ? $"tracking efficiency [%] (axis starts at {low:0} %, not 0)" : "tracking efficiency [%]");
        return plot;
    }

    /// <summary>Colours of the energy split's parts, in <see cref="EnergySplitEntry.Parts"/> order (a sequential palette of their own: the parts are not trackers).</summary>
    private static readonly Color[] SplitColours =
        [Colors.SteelBlue, Colors.DarkOrange, Colors.SeaGreen, Colors.Crimson, Colors.MediumPurple, Colors.DimGray];

    /// <summary>Lost energy per tracker as a stacked bar of its parts (start-up, after events, steady state, lower hill, excursions, after failure).</summary>
    public static Plot EnergySplitBars(RunSummary summary)
    {
        var plot = new Plot();
        var trackers = summary.Trackers.Where(t => t.EnergySplit is not null).ToList();
        var bars = new List<Bar>();
        for (int i = 0; i < trackers.Count; i++)
        {
            double bottom = 0;
            var parts = trackers[i].EnergySplit!.Parts;
            for (int k = 0; k < parts.Count; k++)
            {
                double top = bottom + Math.Max(parts[k].Wh, 0);
                bars.Add(new Bar { Position = i, ValueBase = bottom, Value = top, FillColor = SplitColours[k], LineWidth = 0 });
                bottom = top;
            }
        }
        plot.Add.Bars(bars);
        var labels = trackers[0].EnergySplit!.Parts;
        for (int k = 0; k < labels.Count; k++) plot.Legend.ManualItems.Add(new LegendItem { LabelText = labels[k].Label, FillColor = SplitColours[k] });
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(trackers.Select((t, i) => new Tick(i, t.Failed ? $"{t.Name} (failed)" : t.Name)).ToArray());
        plot.Axes.SetLimitsY(0, Math.Max(1e-9, trackers.Max(t => t.EnergySplit!.TotalWh)) * 1.08);
        plot.Title($"Where the energy went, {summary.Scenario.Name}");
        plot.XLabel("tracker");
        plot.YLabel("energy lost [Wh] (axis starts at 0)");
        plot.ShowLegend(Edge.Right);
        return plot;
    }

    /// <summary>Efficiency per ramp slope per tracker, for standard ramp sequences.</summary>
    public static Plot RampEfficiency(RunSummary summary, TrackerPalette? palette = null)
    {
        palette ??= new TrackerPalette(summary.Trackers.Select(t => t.Name));
        var plot = new Plot();
        foreach (var t in summary.Trackers)
        {
            var ramps = t.Windows.Where(w => w.SlopeWm2PerS is not null && w.Efficiency is not null).OrderBy(w => w.SlopeWm2PerS).ToList();
            if (ramps.Count == 0) continue;
            var line = plot.Add.Scatter(ramps.Select(w => Math.Log10(w.SlopeWm2PerS!.Value)).ToArray(), ramps.Select(w => w.Efficiency!.Value * 100).ToArray());
            line.LegendText = t.Name;
            line.Color = palette[t.Name];
        }
        var slopes = new[] { 0.5, 1, 2, 5, 10, 20, 50, 100 };
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(slopes.Select(s => new Tick(Math.Log10(s), s.ToString(System.Globalization.CultureInfo.InvariantCulture))).ToArray());
        plot.Title("Dynamic tracking efficiency per irradiance ramp slope (EN 50530 sequences)");
        plot.XLabel("ramp slope [W/m2/s] (log scale)");
        plot.YLabel("tracking efficiency [%]");
        plot.ShowLegend(Edge.Right);
        return plot;
    }
}
