using System.Globalization;
using MpptArena.Cli.Terminal;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Plots;
using MpptArena.Reports.Output;
using MpptArena.Reports.Summary;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;
using Spectre.Console;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena run SCENARIO.yaml: runs every tracker and writes a results folder.</summary>
internal static class RunCommand
{
    public const string Usage = "mppt-arena run SCENARIO.yaml [--tracker NAME]... [--out DIR] [--force] [--seed N] [--seeds N|A,B,...] [--threads N] [--full-series] [--no-plots] [--window START:END] [--junit FILE] [--fail-below SCORE=VALUE]... [--fail-above SCORE=VALUE]... [--plugin ASSEMBLY.dll]... [--call-limit-ms MS] [--run-limit-s S] [--memory-limit-mib MIB] [--debug]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "run", ["--tracker", "--out", "--seed", "--seeds", "--threads", "--window", "--junit", "--fail-below", "--fail-above", "--plugin", "--call-limit-ms", "--run-limit-s", "--memory-limit-mib"], ["--full-series", "--no-plots", "--quiet", "--debug", "--force"]);
        a.RequirePositional(1, Usage);
        var registry = Plugins.Registry(a.Options("--plugin"));
        var scenario = ScenarioLoader.Load(a.Positional[0], registry);
        scenario = ApplyOptions(scenario, a);
        foreach (string w in scenario.Warnings) StandardOutput.Error.WriteLine($"warning: {w}");
        int threads = a.Threads(System.Environment.ProcessorCount);
        var gates = Gate.ParseAll(a.Options("--fail-below"), a.Options("--fail-above"));

        gates.CheckAgainst(scenario.Trackers.Select(t => t.Name).ToList(),
            scenario.Scoring.AllWindows.Select(w => w.Name).Concat(scenario.Scoring.AllWindows.Select(w => w.Group).OfType<string>()).Distinct().ToList());
        if (a.Option("--junit") is { } junitPath) JUnitWriter.CheckTarget(junitPath);
        var window = a.Option("--window") is { } windowText ? TimeWindow.Parse(windowText, scenario.Simulation.DurationS) : null;

        bool chosen = a.Option("--out") is not null;
        string requested = a.Option("--out") ?? Path.Combine("results", ResultsWriter.DefaultFolderName(scenario.Name, DateTime.UtcNow));
        using var stage = StagedOutput.Begin(requested, "run", a.Flag("--force"), numberIfTaken: !chosen);
        string workDir = stage.StagingPath;
        RunSummary summary;
        IReadOnlyList<RunResult> results;
        using var interruption = new Interruption();
        var logs = new TrackerLogs(Path.Combine(workDir, "logs"));
        void OnOverrun(string tracker, double limitS)
        {
            // An in-process call that does not return cannot be stopped: end the run, never hang, never exit 0.
            StandardOutput.Error.WriteLine($"error: tracker '{tracker}' runs in process and made no reply within {limitS:0.###} s; it cannot be stopped inside the arena, so the run ends here (run it with 'isolation: process' to have it stopped alone)");
            stage.Dispose();
            System.Environment.Exit(ExitCodes.GateFailed);
        }
        Trackers.Isolation.HostWatchdog.InProcessCallOverrun += OnOverrun;
        try
        {
            Func<TrackerSpec, ISeriesSink?> sinks = spec => new CsvSeriesSink(Path.Combine(workDir, ResultsWriter.SeriesFileName(spec.Name)));
            using (logs.DivertConsole(scenario.Trackers.Any(t => t.Descriptor.IsUserCodeInProcess)))
            {
                results = Simulate(scenario, sinks, logs.For, a.Flag("--quiet"), threads, interruption.Token);
            }
            logs.Dispose();
            summary = ResultsWriter.Write(workDir, results, plots: !a.Flag("--no-plots"), window);
        }
        catch (OperationCanceledException)
        {
            logs.Dispose();
            StandardOutput.Error.WriteLine($"interrupted by {interruption.SignalName}: the run stopped before its end and its partial output was removed; nothing was written to {requested}");
            return interruption.ExitCode;
        }
        catch
        {
            logs.Dispose();
            throw;
        }
        finally
        {
            Trackers.Isolation.HostWatchdog.InProcessCallOverrun -= OnOverrun;
        }
        string finalDir = ShownPath.Of(stage.Commit(["logs"]));

        if (!a.Flag("--quiet")) RankingTable.Print(summary);
        var cases = gates.Check(summary);
        if (a.Option("--junit") is { } junit) JUnitWriter.Write(junit, cases);
        StandardOutput.Out.WriteLine($"results: {finalDir}");
        if (a.Flag("--debug"))
        {
            foreach (var t in results.SelectMany(r => r.Trackers).Where(t => t.Failure is { Details.Length: > 0 }))
            {
                StandardOutput.Error.WriteLine($"--- {t.Name}: {t.Failure!.Reason}\n{t.Failure.Details}");
            }
        }
        var failures = cases.Where(c => c.Failure is not null).ToList();
        foreach (var f in failures) StandardOutput.Error.WriteLine($"gate failed: {f.Name}: {f.Failure}");
        return failures.Count > 0 ? ExitCodes.GateFailed : ExitCodes.Ok;
    }

    private static Scenario ApplyOptions(Scenario s, ArgumentReader a)
    {
        s = LimitOptions.Apply(s, a);
        if (a.Option("--seed") is { } seedText)
        {
            if (!ulong.TryParse(seedText, NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed))
                throw new ArenaInputException($"--seed '{seedText}' must be a whole number of at least 0", "--seed");
            // One run with that seed, whatever the scenario's seed list; with --seeds COUNT it is the first.
            s = s with { Simulation = s.Simulation with { Seed = seed, Seeds = null } };
        }
        if (a.Option("--seeds") is { } seedsText)
        {
            s = s with { Simulation = s.Simulation with { Seeds = SeedSet.ParseOption(seedsText, s.Simulation.Seed) } };
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

    private static IReadOnlyList<RunResult> Simulate(Scenario scenario, Func<TrackerSpec, ISeriesSink?> sinks, Func<TrackerSpec, TextWriter?> logs, bool quiet, int threads, CancellationToken cancel)
    {
        if (quiet) return MultiSeedRunner.Run(scenario, sinks, null, cancel, logs, threads);
        int seeds = scenario.Simulation.SeedList.Count;
        string what = seeds > 1 ? $"{scenario.Name} over {seeds} seeds" : scenario.Name;
        if (!ConsoleMode.Interactive) return MultiSeedRunner.Run(scenario, sinks, new ProgressLines(what), cancel, logs, threads);
        IReadOnlyList<RunResult>? result = null;
        AnsiConsole.Progress()
            .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new RemainingTimeColumn())
            .Start(ctx =>
            {
                var task = ctx.AddTask($"{what}: {scenario.Trackers.Count} trackers, {scenario.Simulation.DurationS:0.#} s", maxValue: 1.0);
                result = MultiSeedRunner.Run(scenario, sinks, new Progress<double>(f => task.Value = f), cancel, logs, threads);
                task.Value = 1.0;
            });
        return result!;
    }
}
