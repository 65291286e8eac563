using System.Globalization;
using MpptArena.Cli.Terminal;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Summary;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;
using Spectre.Console;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena run SCENARIO.yaml: runs every tracker and writes a results folder.</summary>
internal static class RunCommand
{
    public const string Usage = "mppt-arena run SCENARIO.yaml [--tracker NAME]... [--out DIR] [--seed N] [--full-series] [--no-plots] [--junit FILE] [--fail-below SCORE=VALUE]... [--fail-above SCORE=VALUE]... [--plugin ASSEMBLY.dll]...";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "run", ["--tracker", "--out", "--seed", "--junit", "--fail-below", "--fail-above", "--plugin"], ["--full-series", "--no-plots", "--quiet"]);
        a.RequirePositional(1, Usage);
        var registry = Plugins.Registry(a.Options("--plugin"));
        var scenario = ScenarioLoader.Load(a.Positional[0], registry);
        scenario = ApplyOptions(scenario, a);
        var gates = Gate.ParseAll(a.Options("--fail-below"), a.Options("--fail-above"));

        string finalDir = a.Option("--out") ?? Path.Combine("results", ResultsWriter.DefaultFolderName(scenario.Name, DateTime.UtcNow));
        string workDir = finalDir.TrimEnd('/', '\\') + ".partial";
        if (Directory.Exists(workDir)) Directory.Delete(workDir, true);
        Directory.CreateDirectory(workDir);
        RunSummary summary;
        RunResult result;
        try
        {
            Func<TrackerSpec, ISeriesSink?> sinks = spec => new CsvSeriesSink(Path.Combine(workDir, ResultsWriter.SeriesFileName(spec.Name)));
            result = Simulate(scenario, sinks, a.Flag("--quiet"));
            summary = ResultsWriter.Write(workDir, result, plots: !a.Flag("--no-plots"));
        }
        catch
        {
            Directory.Delete(workDir, true);
            throw;
        }
        if (Directory.Exists(finalDir)) Directory.Delete(finalDir, true);
        Directory.Move(workDir, finalDir);

        if (!a.Flag("--quiet")) RankingTable.Print(summary);
        var cases = gates.Check(summary);
        if (a.Option("--junit") is { } junit) JUnitWriter.Write(junit, cases);
        Console.WriteLine($"results: {finalDir}");
        var failures = cases.Where(c => c.Failure is not null).ToList();
        foreach (var f in failures) Console.Error.WriteLine($"gate failed: {f.Name}: {f.Failure}");
        return failures.Count > 0 ? ExitCodes.GateFailed : ExitCodes.Ok;
    }

    private static Scenario ApplyOptions(Scenario s, ArgumentReader a)
    {
        if (a.Option("--seed") is { } seedText)
        {
            if (!ulong.TryParse(seedText, NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed))
                throw new ArenaInputException($"--seed '{seedText}' must be a whole number of at least 0", "--seed");
            s = s with { Simulation = s.Simulation with { Seed = seed } };
        }
        if (a.Flag("--full-series"))
        {
            s = s with { Simulation = s.Simulation with { SeriesIntervalS = 0 } };
        }
        var names = a.Options("--tracker");
        if (names.Count > 0)
        {
            foreach (string n in names.Where(n => s.Trackers.All(t => t.Name != n)))
            {
                throw new ArenaInputException($"--tracker '{n}' is not in the scenario; it has: {string.Join(", ", s.Trackers.Select(t => t.Name))}", "--tracker");
            }
            s = s with { Trackers = s.Trackers.Where(t => names.Contains(t.Name)).ToList() };
        }
        return s;
    }

    private static RunResult Simulate(Scenario scenario, Func<TrackerSpec, ISeriesSink?> sinks, bool quiet)
    {
        var runner = new ScenarioRunner();
        if (quiet || !ConsoleMode.Interactive)
        {
            return runner.Run(scenario, sinks);
        }
        RunResult? result = null;
        AnsiConsole.Progress()
            .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new RemainingTimeColumn())
            .Start(ctx =>
            {
                var task = ctx.AddTask($"{scenario.Name}: {scenario.Trackers.Count} trackers, {scenario.Simulation.DurationS:0.#} s", maxValue: 1.0);
                result = runner.Run(scenario, sinks, new Progress<double>(f => task.Value = f));
                task.Value = 1.0;
            });
        return result!;
    }
}
