using MpptArena.Cli.Terminal;
using System.Globalization;
using MpptArena.Reports.Summary;
using Spectre.Console;

namespace MpptArena.Cli.Terminal;

/// <summary>The ranking printed at the end of a run.</summary>
internal static class RankingTable
{
    public static void Print(RunSummary s)
    {
        var c = CultureInfo.InvariantCulture;
        // Logs and CI consoles report a narrow width; the table needs about 90 columns.
        var table = new Table().Border(TableBorder.Rounded).Title($"[bold]{Markup.Escape(s.Scenario.Name)}[/]");
        table.AddColumn("#");
        table.AddColumn("tracker");
        table.AddColumn(new TableColumn("efficiency").RightAligned().NoWrap());
        table.AddColumn(new TableColumn("lost Wh").RightAligned());
        table.AddColumn(new TableColumn("start-up s").RightAligned());
        table.AddColumn(new TableColumn("settling s").RightAligned());
        table.AddColumn(new TableColumn("unsettled").RightAligned());
        table.AddColumn(new TableColumn("ripple V").RightAligned());
        table.AddColumn(new TableColumn("excursion Wh").RightAligned());
        table.AddColumn(new TableColumn("on global").RightAligned());
        int rank = 1;
        foreach (string name in s.Ranking)
        {
            var t = s.Trackers.First(x => x.Name == name);
            if (t.Failed)
            {
                table.AddRow("-", Markup.Escape(t.Name), "[red]failed[/]", "", "", "", "", "", "", Markup.Escape(t.FailureReason ?? ""));
                continue;
            }
            string F(string key, string f) => t.Scores.GetValueOrDefault(key) is { } v ? v.ToString(f, c) : "n/a";
            table.AddRow(rank++.ToString(c), Markup.Escape(t.Name), Markup.Escape(Reports.Exporters.MarkdownReport.Efficiency(t)),
                F("energy_lost_wh", "0.0000"), F("startup_time_s", "0.000"), F("mean_settling_time_s", "0.000"),
                F("events_never_settled", "0"), F("ripple_voltage_pp_v", "0.00"), F("excursion_energy_lost_wh", "0.0000"), F("global_peak_time_share", "0.000"));
        }
        AnsiConsole.Write(table);
        var seeds = s.Scenario.Seeds ?? [s.Scenario.Seed];
        if (seeds.Count > 1)
        {
            StandardOutput.Out.WriteLine($"over {seeds.Count} seeds ({Reports.Exporters.MarkdownReport.SeedRange(seeds)}): means, efficiency +/- the half width of its 95 % confidence interval");
            string ties = Reports.Exporters.MarkdownReport.Indistinguishable(s);
            if (ties.Length > 0) StandardOutput.Out.WriteLine($"not distinguishable over these seeds: {ties}");
        }
    }
}
