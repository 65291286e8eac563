using System.Globalization;
using System.Text;
using System.Text.Json;
using MpptArena.Procedure;
using MpptArena.Reports.Plots;
using MpptArena.Reports.Summary;
using MpptArena.Reports.Sweeps;
using ScottPlot;

namespace MpptArena.Reports.Procedure;

/// <summary>
/// The report of the MPPT efficiency procedure, built from the points' case results alone (sorted, so it does not
/// depend on threads or order): static efficiency per power level and voltage, the weighted efficiencies, the
/// ramp sequences slope by slope, the start-up and shut-down ramp, the worst points; procedure.md, procedure.json
/// and plots.
/// </summary>
public static class ProcedureReport
{
    /// <summary>One tracker's results.</summary>
    /// <param name="Tracker">Tracker name.</param>
    /// <param name="Static">Static efficiency by (MPP voltage [V], power level [-]); null where a point failed.</param>
    /// <param name="European">European-weighted efficiency by MPP voltage [V].</param>
    /// <param name="Cec">CEC-weighted efficiency by MPP voltage [V].</param>
    /// <param name="Ramps">Dynamic efficiency per ramp block: group, slope [W/m2/s], efficiency.</param>
    /// <param name="DynamicTotals">Energy-ratio efficiency of each whole sequence, by group.</param>
    /// <param name="StartUpShutDown">Efficiency over the start-up and shut-down ramp.</param>
    /// <param name="Failures">Points where the tracker failed, with the reason.</param>
    public sealed record TrackerProcedure(string Tracker, IReadOnlyList<StaticPoint> Static, IReadOnlyDictionary<double, double?> European,
        IReadOnlyDictionary<double, double?> Cec, IReadOnlyList<RampPoint> Ramps, IReadOnlyDictionary<string, double?> DynamicTotals, double? StartUpShutDown,
        IReadOnlyList<string> Failures);

    /// <summary>One static point's result.</summary>
    /// <param name="MppVoltageV">MPP voltage [V].</param>
    /// <param name="Level">Power level [-].</param>
    /// <param name="Efficiency">Static MPPT efficiency over the measurement time [-]; null when the tracker failed.</param>
    public sealed record StaticPoint(double MppVoltageV, double Level, double? Efficiency);

    /// <summary>One ramp block's result.</summary>
    /// <param name="Group">Sequence.</param>
    /// <param name="SlopeWm2PerS">Slope [W/m2/s].</param>
    /// <param name="Efficiency">Dynamic MPPT efficiency over the block [-].</param>
    public sealed record RampPoint(string Group, double SlopeWm2PerS, double? Efficiency);

    /// <summary>Collects every tracker's results from the case results of the points.</summary>
    public static IReadOnlyList<TrackerProcedure> Collect(IReadOnlyList<ProcedurePoint> points, IReadOnlyList<SweepCaseResult> cases)
    {
        var byScenario = points.ToDictionary(p => p.Scenario.Name);
        var trackers = cases.Select(c => c.Tracker).Distinct().Order(StringComparer.Ordinal).ToList();
        var result = new List<TrackerProcedure>();
        foreach (string tracker in trackers)
        {
            var mine = cases.Where(c => c.Tracker == tracker).ToList();
            // Over several seeds a point's value is its mean over the seeds (a failed seed makes it undefined).
            double? Value(ProcedurePoint p, string key)
            {
                var here = mine.Where(c => c.Scenario == p.Scenario.Name).ToList();
                if (here.Count == 0 || here.Any(c => c.Failed || c.Scores.GetValueOrDefault(key) is null)) return null;
                return here.Average(c => c.Scores[key]!.Value);
            }
            var failures = mine.Where(c => c.Failed).OrderBy(c => c.Scenario, StringComparer.Ordinal)
                .Select(c => $"{c.Scenario}{(c.Seed is { } s ? $" (seed {s})" : "")}: {c.FailureReason}").ToList();
            var statics = points.Where(p => p.Kind == ProcedurePointKind.Static)
                .Select(p => new StaticPoint(p.MppVoltageV, p.LevelFraction!.Value, Value(p, ScoreCatalog.WindowPrefix + p.Window))).ToList();
            var voltages = statics.Select(s => s.MppVoltageV).Distinct().Order().ToList();
            double? At(double v, double level) => statics.FirstOrDefault(s => s.MppVoltageV == v && Math.Abs(s.Level - level) < 1e-9)?.Efficiency;
            var ramps = new List<RampPoint>();
            var totals = new SortedDictionary<string, double?>(StringComparer.Ordinal);
            foreach (var p in points.Where(p => p.Kind == ProcedurePointKind.Dynamic))
            {
                foreach (var w in p.Scenario.Scoring.AllWindows)
                {
                    ramps.Add(new RampPoint(p.Window, w.SlopeWm2PerS!.Value, Value(p, ScoreCatalog.WindowPrefix + w.Name)));
                }
                totals[p.Window] = Value(p, ScoreCatalog.WindowPrefix + p.Window);
            }
            var startUp = points.FirstOrDefault(p => p.Kind == ProcedurePointKind.StartUpShutDown) is { } su ? Value(su, ScoreCatalog.WindowPrefix + su.Window) : null;
            result.Add(new TrackerProcedure(tracker, statics,
                voltages.ToDictionary(v => v, v => WeightedEfficiency.Of(ProcedureTable.EuropeanWeights, l => At(v, l))),
                voltages.ToDictionary(v => v, v => WeightedEfficiency.Of(ProcedureTable.CecWeights, l => At(v, l))),
                ramps, totals, startUp, failures));
        }
        return result;
    }

    /// <summary>Writes procedure.md, procedure.json and (optionally) the plots; returns the files written.</summary>
    public static IReadOnlyList<string> Write(string folder, string name, ProcedureSettings settings, IReadOnlyList<TrackerProcedure> results, bool plots)
    {
        var files = new List<string>();
        string md = Path.Combine(folder, "procedure.md");
        File.WriteAllText(md, Markdown(name, settings, results));
        files.Add(md);
        string json = Path.Combine(folder, "procedure.json");
        var doc = new
        {
            schema = "mppt-arena/procedure/1",
            name,
            note = "pre-compliance estimate from numbers recalled from EN 50530 / IEC 62891, not a certified test",
            settings = new
            {
                rated_power_w = settings.RatedPowerW, mpp_voltage_min_v = settings.MinMppVoltageV, mpp_voltage_rated_v = settings.RatedMppVoltageV,
                mpp_voltage_max_v = settings.MaxMppVoltageV, test_array = settings.Shape?.Name ?? "scenario", stabilisation_s = settings.StabilisationS,
                measurement_s = settings.MeasurementS,
            },
            trackers = results.Select(r => new
            {
                name = r.Tracker,
                @static = r.Static.Select(s => new { mpp_voltage_v = s.MppVoltageV, level = s.Level, efficiency = s.Efficiency }),
                european_weighted = r.European.Select(kv => new { mpp_voltage_v = kv.Key, efficiency = kv.Value }),
                cec_weighted = r.Cec.Select(kv => new { mpp_voltage_v = kv.Key, efficiency = kv.Value }),
                ramps = r.Ramps.Select(x => new { sequence = x.Group, slope_w_m2_per_s = x.SlopeWm2PerS, efficiency = x.Efficiency }),
                dynamic_totals = r.DynamicTotals,
                start_up_shut_down = r.StartUpShutDown,
                failures = r.Failures,
            }),
        };
        File.WriteAllText(json, JsonSerializer.Serialize(doc, new JsonSerializerOptions { WriteIndented = true }) + "\n");
        files.Add(json);
        if (!plots) return files;
        var palette = new TrackerPalette(results.Select(r => r.Tracker));
        string staticPng = Path.Combine(folder, "procedure-static.png");
        StaticPlot(results, palette).SavePng(staticPng, PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);
        files.Add(staticPng);
        if (results.Any(r => r.Ramps.Count > 0))
        {
            string rampPng = Path.Combine(folder, "procedure-ramps.png");
            RampPlot(results, palette).SavePng(rampPng, PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);
            files.Add(rampPng);
        }
        return files;
    }

    private static string F(double? v) => v is { } x ? x.ToString("0.0000", CultureInfo.InvariantCulture) : "n/a";

    /// <summary>procedure.md.</summary>
    public static string Markdown(string name, ProcedureSettings s, IReadOnlyList<TrackerProcedure> results)
    {
        var c = CultureInfo.InvariantCulture;
        var sb = new StringBuilder($"# MPPT efficiency procedure: {name}\n\n");
        sb.Append("**A pre-compliance estimate, not a certified test.** Levels, weights, curve shapes and times follow EN 50530:2010 + A1:2013 and ");
        sb.Append("IEC 62891:2020 as recalled from memory (README.md, \"MPPT efficiency procedure\"); only an accredited laboratory's test of the real converter certifies.\n\n");
        sb.Append(c, $"Rated DC power {s.RatedPowerW:0.#} W; MPP voltage min {s.MinMppVoltageV:0.#} V, rated {s.RatedMppVoltageV:0.#} V, max {s.MaxMppVoltageV:0.#} V; ");
        sb.Append(s.Shape is { } shape
            ? string.Create(c, $"test array {shape.Name} (Vmpp/Voc {shape.MppToOpenCircuitVoltage:0.00}, Impp/Isc {shape.MppToShortCircuitCurrent:0.00}), set per point; ")
            : "the scenario's own array, dimmed to each level; ");
        sb.Append(c, $"static points {s.StabilisationS:0.#} s stabilisation, {s.MeasurementS:0.#} s measurement, cells at 25 degC.\n");
        foreach (var r in results)
        {
            sb.Append($"\n## {r.Tracker}\n\n");
            if (r.Failures.Count > 0) sb.Append($"**Failed at {r.Failures.Count} point(s)**: {string.Join("; ", r.Failures.Take(5))}\n\n");
            var voltages = r.European.Keys.ToList();
            sb.Append("### Static MPPT efficiency\n\n| power level | ").Append(string.Join(" | ", voltages.Select(v => string.Create(c, $"{v:0.#} V")))).Append(" |\n|---:|");
            sb.Append(string.Concat(voltages.Select(_ => "---:|"))).Append('\n');
            foreach (double level in ProcedureTable.StaticLevels)
            {
                sb.Append(c, $"| {level * 100:0} % | ").Append(string.Join(" | ", voltages.Select(v => F(r.Static.FirstOrDefault(x => x.MppVoltageV == v && Math.Abs(x.Level - level) < 1e-9)?.Efficiency)))).Append(" |\n");
            }
            sb.Append("| **European weighted** | ").Append(string.Join(" | ", voltages.Select(v => F(r.European[v])))).Append(" |\n");
            sb.Append("| **CEC weighted** | ").Append(string.Join(" | ", voltages.Select(v => F(r.Cec[v])))).Append(" |\n");
            if (r.Ramps.Count > 0)
            {
                sb.Append("\n### Dynamic MPPT efficiency per ramp slope (at the rated MPP voltage)\n\n| sequence | slope (W/m2/s) | efficiency |\n|---|---:|---:|\n");
                foreach (var x in r.Ramps) sb.Append(c, $"| {x.Group} | {x.SlopeWm2PerS:0.##} | {F(x.Efficiency)} |\n");
                foreach (var (group, eta) in r.DynamicTotals) sb.Append($"| {group} | whole sequence | {F(eta)} |\n");
            }
            if (r.StartUpShutDown is not null || r.Ramps.Count > 0) sb.Append($"\nStart-up and shut-down ramp: {F(r.StartUpShutDown)}.\n");
            var worst = r.Static.Where(x => x.Efficiency is not null).OrderBy(x => x.Efficiency).Take(3)
                .Select(x => string.Create(c, $"{x.Level * 100:0} % at {x.MppVoltageV:0.#} V: {x.Efficiency:0.0000}"))
                .Concat(r.Ramps.Where(x => x.Efficiency is not null).OrderBy(x => x.Efficiency).Take(2).Select(x => string.Create(c, $"{x.Group} at {x.SlopeWm2PerS:0.##} W/m2/s: {x.Efficiency:0.0000}")));
            sb.Append($"\nWorst points: {string.Join("; ", worst)}.\n");
        }
        return sb.ToString();
    }

    private static Plot StaticPlot(IReadOnlyList<TrackerProcedure> results, TrackerPalette palette)
    {
        var plot = new Plot();
        LinePattern[] patterns = [LinePattern.Solid, LinePattern.Dashed, LinePattern.Dotted];
        foreach (var r in results)
        {
            var voltages = r.European.Keys.ToList();
            for (int k = 0; k < voltages.Count; k++)
            {
                var pts = r.Static.Where(x => x.MppVoltageV == voltages[k] && x.Efficiency is not null).OrderBy(x => x.Level).ToList();
                if (pts.Count == 0) continue;
                var line = plot.Add.Scatter(pts.Select(x => x.Level * 100).ToArray(), pts.Select(x => x.Efficiency!.Value * 100).ToArray());
                line.Color = palette[r.Tracker];
                line.LinePattern = patterns[k % patterns.Length];
                line.LegendText = string.Create(CultureInfo.InvariantCulture, $"{r.Tracker}, {voltages[k]:0.#} V");
            }
        }
        var all = results.SelectMany(r => r.Static).Where(x => x.Efficiency is not null).Select(x => x.Efficiency!.Value * 100).DefaultIfEmpty(100).ToList();
        double low = Math.Max(0, Math.Floor(all.Min() - 1));
        plot.Axes.SetLimits(0, 102, low, 100.2);
        plot.Title("Static MPPT efficiency against power level, per MPP voltage (solid: min, dashed: rated, dotted: max voltage)");
        plot.XLabel("power level [% of rated DC power]");
        // Differences of a fraction of a point matter here, so the axis is zoomed; the label says where it starts.
        plot.YLabel(low > 0 ? $"static MPPT efficiency [%] (axis starts at {low:0} %, not 0)" : "static MPPT efficiency [%]");
        plot.ShowLegend(Edge.Right);
        return plot;
    }

    private static Plot RampPlot(IReadOnlyList<TrackerProcedure> results, TrackerPalette palette)
    {
        var plot = new Plot();
        foreach (var r in results)
        {
            foreach (var group in r.Ramps.GroupBy(x => x.Group))
            {
                var pts = group.Where(x => x.Efficiency is not null).OrderBy(x => x.SlopeWm2PerS).ToList();
                if (pts.Count == 0) continue;
                var line = plot.Add.Scatter(pts.Select(x => Math.Log10(x.SlopeWm2PerS)).ToArray(), pts.Select(x => x.Efficiency!.Value * 100).ToArray());
                line.Color = palette[r.Tracker];
                line.LinePattern = group.Key == ProcedurePlan.LowGroup ? LinePattern.Solid : LinePattern.Dashed;
                line.LegendText = $"{r.Tracker}, {group.Key}";
            }
        }
        var slopes = new[] { 0.5, 1, 2, 5, 10, 20, 50, 100 };
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(slopes.Select(s => new Tick(Math.Log10(s), s.ToString(CultureInfo.InvariantCulture))).ToArray());
        plot.Title("Dynamic MPPT efficiency per ramp slope");
        plot.XLabel("ramp slope [W/m2/s] (log scale)");
        plot.YLabel("dynamic MPPT efficiency [%]");
        plot.ShowLegend(Edge.Right);
        return plot;
    }
}
