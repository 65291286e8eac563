using MpptArena.Cli.Terminal;
using System.Globalization;
using MpptArena.Arrays;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Output;
using MpptArena.Reports.Plots;
using MpptArena.Scenarios;
using Spectre.Console;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena curve FILE.yaml: the array's I-V and P-V curves and every MPP, as CSV, PNG and a table.</summary>
internal static class CurveCommand
{
    public const string Usage = "mppt-arena curve PLANT_OR_SCENARIO.yaml [--at SECONDS] [--out DIR] [--force] [--points N]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "curve", ["--at", "--out", "--points"], ["--force"]);
        a.RequirePositional(1, Usage);
        double at = ParseNumber(a.Option("--at") ?? "0", "--at", 0);
        int points = (int)ParseNumber(a.Option("--points") ?? "1000", "--points", 10, MaxPoints);
        var (name, array, conditions) = ScenarioLoader.LoadCurveSetup(a.Positional[0], at);
        using var stage = StagedOutput.Begin(a.Option("--out") ?? Path.Combine("results", $"{name}-curve"), "curve", a.Flag("--force"), numberIfTaken: a.Option("--out") is null);
        // Sampled and searched on the prepared curve (milliseconds); only the peaks are refined on the exact solve.
        var exact = array.Solve(conditions);
        var prepared = new PreparedArrayCurve(exact);
        var peaks = MppSearch.RefineOnExact(MppSearch.FindPeaks(prepared), exact);
        var (v, i) = CurveExport.Sample(prepared, points);

        string folder = stage.StagingPath;
        File.WriteAllText(Path.Combine(folder, "curve.csv"), CurveExport.Csv(v, i));
        File.WriteAllText(Path.Combine(folder, "peaks.csv"), CurveExport.PeaksCsv(peaks));
        string title = at > 0 ? $"{name} at t = {at.ToString("0.###", CultureInfo.InvariantCulture)} s" : name;
        CurvePlots.CurrentVoltage(title, v, i, peaks).SavePng(Path.Combine(folder, "iv-curve.png"), PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);
        CurvePlots.PowerVoltage(title, v, i, peaks).SavePng(Path.Combine(folder, "pv-curve.png"), PlotWriter.DefaultWidth, PlotWriter.DefaultHeight);

        var c = CultureInfo.InvariantCulture;
        var table = new Table().Border(TableBorder.Rounded).Title($"[bold]{Markup.Escape(title)}[/]: Voc {exact.OpenCircuitVoltageV.ToString("0.00", c)} V, Isc {Math.Max(exact.ShortCircuitCurrentA, 0.0).ToString("0.000", c)} A");
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
        StandardOutput.Out.WriteLine($"results: {ShownPath.Of(stage.Commit())}");
        return ExitCodes.Ok;
    }

    /// <summary>Most points on a curve: far finer than any plot or CSV needs.</summary>
    public const int MaxPoints = 1_000_000;

    internal static double ParseNumber(string text, string option, double min, double max = double.MaxValue)
    {
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v) || v < min || v > max)
        {
            string range = max < double.MaxValue ? $"from {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)}" : $"of at least {min.ToString(CultureInfo.InvariantCulture)}";
            throw new ArenaInputException($"{option} '{text}' must be a number {range}", option);
        }
        return v;
    }
}
