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
        sb.Append(c, $"Simulated {s.Scenario.DurationS:0.###} s at a {s.Scenario.PlantStepS * 1e6:0.##} us plant step, seed {s.Scenario.Seed}, plant {s.Scenario.PlantDigest}, mppt-arena {s.ToolVersion}.\n\n");
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
            sb.Append(c, $"| {rank++} | {t.Name} | {t.Kind} | {F("tracking_efficiency", "0.0000")} | {F("static_efficiency", "0.0000")} | {F("energy_lost_wh", "0.0000")} | {F("startup_time_s", "0.000")} | {F("mean_settling_time_s", "0.000")} | {F("events_never_settled", "0")} | {F("ripple_voltage_pp_v", "0.00")} | {F("excursion_energy_lost_wh", "0.0000")} | {F("global_peak_time_share", "0.000")} |\n");
        }
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
}
