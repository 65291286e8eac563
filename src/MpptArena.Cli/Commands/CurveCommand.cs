using MpptArena.Cli.Terminal;
using System.Globalization;
using MpptArena.Arrays;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Plots;
using MpptArena.Scenarios;
using Spectre.Console;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena curve FILE.yaml: the array's I-V and P-V curves and every MPP, as CSV, PNG and a table.</summary>
internal static class CurveCommand
{
    public const string Usage = "mppt-arena curve PLANT_OR_SCENARIO.yaml [--at SECONDS] [--out DIR] [--points N]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "curve", ["--at", "--out", "--points"], []);
        a.RequirePositional(1, Usage);
        double at = ParseNumber(a.Option("--at") ?? "0", "--at", 0);
        int points = (int)ParseNumber(a.Option("--points") ?? "1000", "--points", 10);
        var (name, array, conditions) = ScenarioLoader.LoadCurveSetup(a.Positional[0], at);
        var exact = array.Solve(conditions);
        var peaks = MppSearch.FindPeaks(exact);
        var (v, i) = CurveExport.Sample(exact, points);

        string folder = a.Option("--out") ?? Path.Combine("results", $"{name}-curve");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "curve.csv"), CurveExport.Csv(v, i));
        File.WriteAllText(Path.Combine(folder, "peaks.csv"), CurveExport.PeaksCsv(peaks));
        string title = at > 0 ? $"{name} at t = {at.ToString("0.###", CultureInfo.InvariantCulture)} s" : name;
        CurvePlots.CurrentVoltage(title, v, i, peaks).SavePng(Path.Combine(folder, "iv-curve.png"), PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);
        CurvePlots.PowerVoltage(title, v, i, peaks).SavePng(Path.Combine(folder, "pv-curve.png"), PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);

        var c = CultureInfo.InvariantCulture;
        var table = new Table().Border(TableBorder.Rounded).Title($"[bold]{Markup.Escape(title)}[/]: Voc {exact.OpenCircuitVoltageV.ToString("0.00", c)} V, Isc {exact.ShortCircuitCurrentA.ToString("0.000", c)} A");
        table.AddColumn("peak");
        table.AddColumn(new TableColumn("voltage V").RightAligned());
        table.AddColumn(new TableColumn("current A").RightAligned());
        table.AddColumn(new TableColumn("power W").RightAligned());
        table.AddColumn("");
        for (int k = 0; k < peaks.Peaks.Count; k++)
        {
            var p = peaks.Peaks[k];
            table.AddRow((k + 1).ToString(c), p.VoltageV.ToString("0.00", c), p.CurrentA.ToString("0.000", c), p.PowerW.ToString("0.00", c),
                k == peaks.GlobalIndex ? "[bold]global[/]" : "local");
        }
        AnsiConsole.Write(table);
        StandardOutput.Out.WriteLine($"results: {folder}");
        return ExitCodes.Ok;
    }

    internal static double ParseNumber(string text, string option, double min)
    {
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v) || v < min)
        {
            throw new ArenaInputException($"{option} '{text}' must be a number of at least {min.ToString(CultureInfo.InvariantCulture)}", option);
        }
        return v;
    }
}
