using System.Globalization;
using System.Text;
using System.Text.Json;
using MpptArena.Reports.Summary;
using ScottPlot;

namespace MpptArena.Reports.Sweeps;

/// <summary>
/// The aggregate outputs of a sweep, built from the case files alone, sorted so that they do not depend
/// on how the cases were run (threads, shards, order): cases.csv, cases.json, best.md, and the heat maps
/// and Pareto plots.
/// </summary>
public static class SweepReport
{
    /// <summary>One setting of a tracker (period and parameters) across the scenarios of the suite.</summary>
    public sealed record Setting(string Tracker, string Kind, double PeriodMs, SortedDictionary<string, double> Parameters, IReadOnlyList<SweepCaseResult> Cases, string Objective)
    {
        private bool Undefined => Cases.Any(c => c.Failed || c.Scores.GetValueOrDefault(Objective) is null);

        /// <summary>The objective per scenario: its value, or over several seeds its mean over them; in scenario name order.</summary>
        private List<double> PerScenario => Cases.GroupBy(c => c.Scenario).OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => g.Average(c => c.Scores[Objective]!.Value)).ToList();

        /// <summary>Mean of the objective over scenarios (each scenario's mean over its seeds); failed cases count as undefined and make it null.</summary>
        public double? Mean => Undefined ? null : PerScenario.Average();

        /// <summary>Worst scenario's objective (in the objective's own direction; over seeds, the scenario's mean).</summary>
        public double? Worst
        {
            get
            {
                if (Undefined) return null;
                var values = PerScenario;
                return ScoreCatalog.Find(Objective)?.Direction == ScoreDirection.LowerIsBetter ? values.Max() : values.Min();
            }
        }

        /// <summary>
        /// The objective per seed draw: the k-th value is the mean over the scenarios of each one's k-th seed (in seed
        /// order), when every scenario ran the same number (at least two) of seeds; null otherwise. Every setting of a
        /// sweep runs the same seeds, so two settings are compared draw by draw on these.
        /// </summary>
        public IReadOnlyList<double>? PerSeed
        {
            get
            {
                if (Undefined || Cases.Any(c => c.Seed is null)) return null;
                var byScenario = Cases.GroupBy(c => c.Scenario).Select(g => g.OrderBy(c => c.Seed!.Value).Select(c => c.Scores[Objective]!.Value).ToList()).ToList();
                int n = byScenario[0].Count;
                if (n < 2 || byScenario.Any(v => v.Count != n)) return null;
                return Enumerable.Range(0, n).Select(k => byScenario.Average(v => v[k])).ToList();
            }
        }

        /// <summary>Mean settling time over scenarios (undefined scenarios left out), null if none settled.</summary>
        public double? MeanSettlingS
        {
            get
            {
                var v = Cases.Select(c => c.Scores.GetValueOrDefault("mean_settling_time_s")).Where(x => x is not null).Select(x => x!.Value).ToList();
                return v.Count > 0 ? v.Average() : null;
            }
        }

        /// <summary>"name=value" list for tables.</summary>
        public string Describe() => string.Join(", ", new[] { $"period_ms={PeriodMs.ToString("G6", CultureInfo.InvariantCulture)}" }
            .Concat(Parameters.Select(p => $"{p.Key}={p.Value.ToString("G6", CultureInfo.InvariantCulture)}")));
    }

    /// <summary>Cases in their canonical order: tracker, scenario, period, parameters.</summary>
    public static List<SweepCaseResult> Sorted(IEnumerable<SweepCaseResult> cases) =>
        cases.OrderBy(c => c.Tracker, StringComparer.Ordinal).ThenBy(c => c.PeriodMs)
            .ThenBy(c => string.Join(",", c.Parameters.Select(p => p.Key + "=" + p.Value.ToString("R", CultureInfo.InvariantCulture))), StringComparer.Ordinal)
            .ThenBy(c => c.Scenario, StringComparer.Ordinal).ThenBy(c => c.Seed ?? 0).ThenBy(c => c.CaseId, StringComparer.Ordinal).ToList();

    /// <summary>Settings grouped from cases.</summary>
    public static List<Setting> Settings(IReadOnlyList<SweepCaseResult> sorted, string objective) =>
        sorted.GroupBy(c => (c.Tracker, c.PeriodMs, Key: string.Join(",", c.Parameters.Select(p => p.Key + "=" + p.Value.ToString("R", CultureInfo.InvariantCulture)))))
            .Select(g => new Setting(g.Key.Tracker, g.First().Kind, g.Key.PeriodMs, g.First().Parameters, g.ToList(), objective)).ToList();

    /// <summary>Writes every aggregate output; returns the files written.</summary>
    public static IReadOnlyList<string> Write(string output, IEnumerable<SweepCaseResult> cases, string objective, string? heatmapX, string? heatmapY, bool plots = true)
    {
        var sorted = Sorted(cases);
        var files = new List<string>();
        string csv = Path.Combine(output, "cases.csv");
        File.WriteAllText(csv, Csv(sorted));
        files.Add(csv);
        string json = Path.Combine(output, "cases.json");
        File.WriteAllText(json, JsonSerializer.Serialize(sorted, SummaryJson.Options) + "\n");
        files.Add(json);
        var settings = Settings(sorted, objective);
        string best = Path.Combine(output, "best.md");
        File.WriteAllText(best, BestTables(settings, objective));
        files.Add(best);
        if (!plots) return files;
        foreach (var group in settings.GroupBy(s => s.Tracker))
        {
            var list = group.ToList();
            if (Heatmap(list, heatmapX, heatmapY, objective) is { } hm)
            {
                string file = Path.Combine(output, $"heatmap-{group.Key}.png");
                hm.SavePng(file, Plots.PlotWriter.DefaultWidth, Plots.PlotWriter.DefaultHeight);
                files.Add(file);
            }
            string pareto = Path.Combine(output, $"pareto-{group.Key}.png");
            Pareto(list, objective).SavePng(pareto, Plots.PlotWriter.DefaultWidth, Plots.PlotWriter.DefaultHeight);
            files.Add(pareto);
        }
        return files;
    }

    /// <summary>cases.csv: one row per case, parameters and every score as columns.</summary>
    public static string Csv(IReadOnlyList<SweepCaseResult> sorted)
    {
        var c = CultureInfo.InvariantCulture;
        var parameterNames = sorted.SelectMany(r => r.Parameters.Keys).Distinct().Order(StringComparer.Ordinal).ToList();
        var scoreNames = ScoreCatalog.All.Select(s => s.Key).Concat(sorted.SelectMany(r => r.Scores.Keys).Where(k => k.StartsWith(ScoreCatalog.WindowPrefix, StringComparison.Ordinal)).Distinct().Order(StringComparer.Ordinal)).ToList();
        bool seeds = sorted.Any(r => r.Seed is not null);
        var sb = new StringBuilder();
        sb.Append(seeds ? "case_id,scenario,seed,tracker,kind,period_ms," : "case_id,scenario,tracker,kind,period_ms,").Append(string.Concat(parameterNames.Select(p => p + ","))).Append("failed,")
          .Append(string.Join(",", scoreNames)).Append('\n');
        foreach (var r in sorted)
        {
            sb.Append(r.CaseId).Append(',').Append(r.Scenario).Append(',');
            if (seeds) sb.Append(r.Seed?.ToString(c) ?? "").Append(',');
            sb.Append(r.Tracker).Append(',').Append(r.Kind).Append(',')
              .Append(r.PeriodMs.ToString("R", c)).Append(',');
            foreach (string p in parameterNames) sb.Append(r.Parameters.TryGetValue(p, out double v) ? v.ToString("R", c) : "").Append(',');
            sb.Append(r.Failed ? "true" : "false").Append(',');
            sb.Append(string.Join(",", scoreNames.Select(s => r.Scores.GetValueOrDefault(s) is { } v ? v.ToString("R", c) : ""))).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>best.md: per tracker, the best settings by mean objective, by worst case, and by settling time.</summary>
    public static string BestTables(IReadOnlyList<Setting> settings, string objective)
    {
        var c = CultureInfo.InvariantCulture;
        bool lower = ScoreCatalog.Find(objective)?.Direction == ScoreDirection.LowerIsBetter;
        var sb = new StringBuilder("# Best settings\n\n");
        int scenarios = settings.FirstOrDefault()?.Cases.Select(x => x.Scenario).Distinct().Count() ?? 0;
        int seedCount = settings.FirstOrDefault()?.PerSeed?.Count ?? 1;
        sb.Append($"Objective: `{objective}` ({(lower ? "lower" : "higher")} is better), over {scenarios} scenario(s) per setting");
        sb.Append(seedCount > 1 ? $", each the mean over {seedCount} seeds. \"vs first\" compares a setting with the first of its table seed by seed (95 % interval of the paired difference): \"same\" when the seeds cannot tell them apart." : ".");
        sb.Append(" Failed settings are left out.\n");
        string F(double? v, string f) => v is { } x ? x.ToString(f, c) : "n/a";
        foreach (var group in settings.GroupBy(s => s.Tracker))
        {
            var ok = group.Where(s => s.Mean is not null).ToList();
            sb.Append($"\n## {group.Key} ({group.First().Kind}), {group.Count()} settings, {group.Count() - ok.Count} failed\n");
            void Table(string title, IEnumerable<Setting> ranked)
            {
                var top = ranked.Take(5).ToList();
                bool paired = top.Count > 0 && top.All(x => x.PerSeed is not null);
                sb.Append($"\n### {title}\n\n| # | setting | mean {objective} | worst {objective} | mean settling (s) |{(paired ? " vs first |" : "")}\n|---:|---|---:|---:|---:|{(paired ? "---|" : "")}\n");
                int k = 1;
                foreach (var s in top)
                {
                    string versus = !paired ? "" : k == 1 ? " - |" : $" {VersusFirst(top[0], s, lower)} |";
                    sb.Append($"| {k++} | {s.Describe()} | {F(s.Mean, "G6")} | {F(s.Worst, "G6")} | {F(s.MeanSettlingS, "0.000")} |{versus}\n");
                }
            }
            Func<Setting, double> by(Func<Setting, double?> f, bool ascending) => s => (ascending ? 1 : -1) * (f(s) ?? (ascending ? double.PositiveInfinity : double.NegativeInfinity));
            Table("By mean over scenarios", ok.OrderBy(by(s => s.Mean, lower)).ThenBy(s => s.Describe(), StringComparer.Ordinal));
            Table("By worst scenario", ok.OrderBy(by(s => s.Worst, lower)).ThenBy(s => s.Describe(), StringComparer.Ordinal));
            Table("By mean settling time", ok.OrderBy(by(s => s.MeanSettlingS, true)).ThenBy(s => s.Describe(), StringComparer.Ordinal));
        }
        return sb.ToString();
    }

    /// <summary>"same" when the seed-by-seed difference of <paramref name="other"/> from <paramref name="first"/> has a 95 % interval that holds zero, else "worse" or "better" with the mean difference.</summary>
    private static string VersusFirst(Setting first, Setting other, bool lower)
    {
        var a = first.PerSeed!;
        var b = other.PerSeed!;
        if (a.Count != b.Count) return "n/a";
        var d = MpptArena.Statistics.SampleSummary.OfDifferences(a, b);
        string diff = d.Mean.ToString("+0.#####;-0.#####", CultureInfo.InvariantCulture);
        if (d.IntervalHoldsZero) return $"same ({diff})";
        return (d.Mean < 0) ^ lower ? $"worse ({diff})" : $"better ({diff})";
    }

    private static double AxisValue(Setting s, string axis) => axis == "period_ms" ? s.PeriodMs : s.Parameters.GetValueOrDefault(axis, double.NaN);

    /// <summary>Mean objective over two axes (averaged over any other swept quantity), as labelled cells; null when fewer than two axes vary.</summary>
    public static Plot? Heatmap(IReadOnlyList<Setting> settings, string? xAxis, string? yAxis, string objective)
    {
        var varying = new[] { "period_ms" }.Concat(settings.SelectMany(s => s.Parameters.Keys).Distinct().Order(StringComparer.Ordinal))
            .Where(a => settings.Select(s => AxisValue(s, a)).Distinct().Count() > 1).ToList();
        string? x = xAxis is not null && varying.Contains(xAxis) ? xAxis : varying.FirstOrDefault(a => a != yAxis);
        string? y = yAxis is not null && varying.Contains(yAxis) && yAxis != x ? yAxis : varying.FirstOrDefault(a => a != x);
        if (x is null || y is null) return null;
        var xs = settings.Select(s => AxisValue(s, x)).Distinct().Order().ToList();
        var ys = settings.Select(s => AxisValue(s, y)).Distinct().Order().ToList();
        if (xs.Count * ys.Count > 2500) return null; // sampled (not grid) sweeps: no meaningful cells
        var cells = new double?[xs.Count, ys.Count];
        for (int i = 0; i < xs.Count; i++)
        for (int j = 0; j < ys.Count; j++)
        {
            var here = settings.Where(s => AxisValue(s, x) == xs[i] && AxisValue(s, y) == ys[j] && s.Mean is not null).ToList();
            cells[i, j] = here.Count > 0 ? here.Average(s => s.Mean!.Value) : null;
        }
        var defined = cells.Cast<double?>().Where(v => v is not null).Select(v => v!.Value).ToList();
        if (defined.Count == 0) return null;
        double lo = defined.Min(), hi = defined.Max();
        var plot = new Plot();
        var map = new ScottPlot.Colormaps.Viridis();
        bool lower = ScoreCatalog.Find(objective)?.Direction == ScoreDirection.LowerIsBetter;
        for (int i = 0; i < xs.Count; i++)
        for (int j = 0; j < ys.Count; j++)
        {
            var r = plot.Add.Rectangle(i - 0.5, i + 0.5, j - 0.5, j + 0.5);
            r.LineWidth = 0;
            if (cells[i, j] is { } v)
            {
                double u = hi > lo ? (v - lo) / (hi - lo) : 0.5;
                r.FillColor = map.GetColor(lower ? 1 - u : u);
                var t = plot.Add.Text(v.ToString("G4", CultureInfo.InvariantCulture), i, j);
                t.LabelAlignment = Alignment.MiddleCenter;
                t.LabelFontColor = u > 0.6 && !lower || u < 0.4 && lower ? Colors.Black : Colors.White;
                t.LabelFontSize = Math.Clamp(400f / Math.Max(xs.Count, ys.Count), 8, 18);
            }
            else
            {
                r.FillColor = Colors.LightGray;
            }
        }
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(xs.Select((v, i) => new Tick(i, v.ToString("G4", CultureInfo.InvariantCulture))).ToArray());
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ys.Select((v, j) => new Tick(j, v.ToString("G4", CultureInfo.InvariantCulture))).ToArray());
        plot.Axes.SetLimits(-0.5, xs.Count - 0.5, -0.5, ys.Count - 0.5);
        plot.Title($"{settings[0].Tracker}: mean {objective} over the suite (brighter is better)");
        plot.XLabel(x);
        plot.YLabel(y);
        return plot;
    }

    /// <summary>Mean objective against mean settling time per setting, with the Pareto front joined.</summary>
    public static Plot Pareto(IReadOnlyList<Setting> settings, string objective)
    {
        var plot = new Plot();
        var pts = settings.Where(s => s.Mean is not null && s.MeanSettlingS is not null).Select(s => (X: s.MeanSettlingS!.Value, Y: s.Mean!.Value)).ToList();
        bool lower = ScoreCatalog.Find(objective)?.Direction == ScoreDirection.LowerIsBetter;
        if (pts.Count > 0)
        {
            var all = plot.Add.ScatterPoints(pts.Select(p => p.X).ToArray(), pts.Select(p => p.Y).ToArray());
            all.LegendText = "settings";
            all.MarkerSize = 7;
            // Front: no other setting settles faster and scores better.
            var front = pts.Where(p => !pts.Any(q => q.X <= p.X && (lower ? q.Y <= p.Y : q.Y >= p.Y) && (q.X < p.X || q.Y != p.Y))).OrderBy(p => p.X).ToList();
            var line = plot.Add.ScatterLine(front.Select(p => p.X).ToArray(), front.Select(p => p.Y).ToArray());
            line.LegendText = "Pareto front";
            line.Color = Colors.Red;
            line.LineWidth = 2;
            line.MarkerSize = 9;
            line.MarkerShape = MarkerShape.FilledCircle;
        }
        plot.Title($"{settings[0].Tracker}: {objective} against settling time");
        plot.XLabel("mean settling time [s]");
        plot.YLabel($"mean {objective} [{ScoreCatalog.Find(objective)?.Unit ?? "-"}]");
        plot.ShowLegend(Alignment.LowerRight);
        return plot;
    }
}
