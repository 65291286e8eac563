using System.Globalization;
using System.Text;
using MpptArena.Reports.Summary;

namespace MpptArena.Reports.Exporters;

/// <summary>summary.md: a ranked table readable in a CI job summary or a pull request.</summary>
public static class MarkdownReport
{
    /// <summary>Markdown text for a summary.</summary>
    public static string Render(RunSummary s)
    {
        var c = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.Append("# ").Append(s.Scenario.Name).Append("\n\n");
        if (s.Scenario.Description.Length > 0) sb.Append(s.Scenario.Description.Trim()).Append("\n\n");
        var seeds = s.Scenario.Seeds ?? [s.Scenario.Seed];
        string seedText = seeds.Count > 1 ? $"{seeds.Count} seeds ({SeedRange(seeds)}); scores are means over the seeds, efficiency with its 95 % confidence interval" : $"seed {s.Scenario.Seed}";
        sb.Append(c, $"Simulated {s.Scenario.DurationS:0.###} s at a {s.Scenario.PlantStepS * 1e6:0.##} us plant step, {seedText}, plant {s.Scenario.PlantDigest}, mppt-arena {s.ToolVersion}.\n\n");
        sb.Append("| rank | tracker | kind | efficiency | static | energy lost (Wh) | start-up (s) | mean settling (s) | never settled | ripple V p-p | excursion loss (Wh) | on global peak |\n");
        sb.Append("|---:|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|\n");
        int rank = 1;
        foreach (string name in s.Ranking)
        {
            var t = s.Trackers.First(x => x.Name == name);
            if (t.Failed)
            {
                sb.Append(c, $"| - | {t.Name} | {t.Kind} | failed at {t.FailureTimeS:0.###} s: {t.FailureReason} | | | | | | | |\n");
                continue;
            }
            string F(string key, string format) => t.Scores.GetValueOrDefault(key) is { } v ? v.ToString(format, c) : "n/a";
            sb.Append(c, $"| {rank++} | {t.Name} | {t.Kind} | {Efficiency(t)} | {F("static_efficiency", "0.0000")} | {F("energy_lost_wh", "0.0000")} | {F("startup_time_s", "0.000")} | {F("mean_settling_time_s", "0.000")} | {F("events_never_settled", "0")} | {F("ripple_voltage_pp_v", "0.00")} | {F("excursion_energy_lost_wh", "0.0000")} | {F("global_peak_time_share", "0.000")} |\n");
        }
        if (seeds.Count > 1) AppendSeedStatistics(sb, s);
        AppendEnergySplit(sb, s);
        var dcm = s.Trackers.Where(t => t.DiscontinuousConductionShare is not null).ToList();
        if (dcm.Count > 0)
        {
            sb.Append("\nTime in discontinuous conduction: ");
            sb.Append(string.Join(", ", dcm.Select(t => string.Create(c, $"{t.Name} {t.DiscontinuousConductionShare:0.0%}"))));
            sb.Append(".\n");
        }
        var windowNames = s.Trackers.SelectMany(t => t.Windows).Select(w => w.Name).Distinct().ToList();
        if (windowNames.Count > 0)
        {
            sb.Append("\n## Efficiency per window\n\n| window | ").Append(string.Join(" | ", s.Trackers.Select(t => t.Name))).Append(" |\n");
            sb.Append("|---|").Append(string.Concat(s.Trackers.Select(_ => "---:|"))).Append('\n');
            foreach (string w in windowNames)
            {
                sb.Append("| ").Append(w).Append(" | ");
                sb.Append(string.Join(" | ", s.Trackers.Select(t => t.Windows.FirstOrDefault(x => x.Name == w) is { Efficiency: { } e } ? e.ToString("0.0000", c) : "n/a")));
                sb.Append(" |\n");
            }
        }
        sb.Append("\nEfficiency is the energy ratio of EN 50530 / IEC 62891 against the true global MPP. ");
        sb.Append("Definitions of every score: README.md, section \"Scores\".\n");
        return sb.ToString();
    }

    /// <summary>Tracking efficiency as the table shows it: the value, or over seeds the mean with the half width of its 95 % interval.</summary>
    public static string Efficiency(TrackerSummary t)
    {
        var c = CultureInfo.InvariantCulture;
        if (t.Scores.GetValueOrDefault("tracking_efficiency") is not { } e) return "n/a";
        if (t.Statistics?.GetValueOrDefault("tracking_efficiency") is { ConfidenceHigh: { } hi, ConfidenceLow: { } lo })
        {
            return string.Create(c, $"{e:0.0000} ± {0.5 * (hi - lo):0.0000}");
        }
        return e.ToString("0.0000", c);
    }

    /// <summary>"3 to 18" for consecutive seeds, else the list.</summary>
    public static string SeedRange(IReadOnlyList<ulong> seeds)
    {
        bool consecutive = seeds.Zip(seeds.Skip(1)).All(p => p.Second == p.First + 1);
        return consecutive && seeds.Count > 2 ? $"{seeds[0]} to {seeds[^1]}" : string.Join(", ", seeds);
    }

    /// <summary>Which trackers the seeds cannot tell apart, and the spread of the main scores over seeds.</summary>
    public static string Indistinguishable(RunSummary s)
    {
        var c = CultureInfo.InvariantCulture;
        if (s.Indistinguishable is not { Count: > 0 } pairs) return "";
        return string.Join("; ", pairs.Select(p => string.Create(c,
            $"{p.First} and {p.Second} (difference {p.MeanDifference:+0.00000;-0.00000}, 95 % interval [{p.ConfidenceLow:0.00000}, {p.ConfidenceHigh:0.00000}])")));
    }

    private static void AppendSeedStatistics(StringBuilder sb, RunSummary s)
    {
        var c = CultureInfo.InvariantCulture;
        string ties = Indistinguishable(s);
        sb.Append(ties.Length > 0
            ? $"\nNot distinguishable over these seeds (their seed-by-seed efficiency difference has a 95 % interval that holds zero): {ties}.\n"
            : "\nEvery pair of trackers is distinguishable over these seeds (each seed-by-seed efficiency difference has a 95 % interval that excludes zero).\n");
        sb.Append("\n## Spread over seeds\n\n| tracker | score | mean | standard deviation | min | max | 95 % interval of the mean |\n|---|---|---:|---:|---:|---:|---|\n");
        string[] keys = ["tracking_efficiency", "energy_lost_wh", "mean_settling_time_s", "ripple_voltage_pp_v", "global_peak_time_share"];
        foreach (var t in s.Trackers.Where(t => t.Statistics is not null))
        {
            foreach (string key in keys)
            {
                if (t.Statistics!.GetValueOrDefault(key) is not { } st) continue;
                string undefined = st.Undefined > 0 ? $" ({st.Undefined} seed(s) undefined)" : "";
                sb.Append(c, $"| {t.Name} | {key}{undefined} | {st.Mean:G6} | {st.StandardDeviation:G3} | {st.Min:G6} | {st.Max:G6} | [{st.ConfidenceLow:G6}, {st.ConfidenceHigh:G6}] |\n");
            }
        }
    }

    /// <summary>Where each tracker's lost energy went, and which trackers stalled.</summary>
    private static void AppendEnergySplit(StringBuilder sb, RunSummary s)
    {
        var c = CultureInfo.InvariantCulture;
        var withSplit = s.Trackers.Where(t => t.EnergySplit is not null).ToList();
        if (withSplit.Count == 0) return;
        sb.Append("\n## Where the energy went\n\nLost energy (available at the global MPP minus taken) in Wh, each plant step booked to one part; the parts add up to the total. ");
        sb.Append("A step on a lower hill of a multi-peak curve is booked there first; otherwise before settling to start-up or after events, once settled to steady state (inside the band) or excursions (outside it).\n\n");
        sb.Append("| tracker | start-up | after events | steady state | lower hill | excursions | after failure | total lost | stalled |\n|---|---:|---:|---:|---:|---:|---:|---:|---|\n");
        foreach (var t in withSplit)
        {
            var e = t.EnergySplit!;
            string stall = t.Stall is { Stalled: true } st ? string.Create(c, $"yes: {st.StallTimeS:0.###} s from {st.FirstStallS:0.###} s, {st.StallEnergyLostWh:0.####} Wh") : "no";
            sb.Append(c, $"| {t.Name} | {e.StartupWh:0.0000} | {e.AfterEventsWh:0.0000} | {e.SteadyStateWh:0.0000} | {e.LowerHillWh:0.0000} | {e.ExcursionsWh:0.0000} | {e.AfterFailureWh:0.0000} | {e.TotalWh:0.0000} | {stall} |\n");
        }
        sb.Append("\nStalled: the command stayed frozen while the MPP voltage moved away from where it was when the command last changed by more than the stall fraction (`scoring.stall_fraction`).\n");
    }
}
