using System.Globalization;
using System.Text;
using System.Text.Json;
using MpptArena.Cli.Terminal;
using MpptArena.Reports.Output;
using MpptArena.Reports.Summary;
using MpptArena.Reports.Sweeps;
using MpptArena.Sweeps;
using Spectre.Console;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena sweep SWEEP.yaml: runs (a shard of) a parameter sweep in parallel, resumable; or tunes with --tune.</summary>
internal static class SweepCommand
{
    public const string Usage = "mppt-arena sweep SWEEP.yaml [--out DIR] [--force] [--shard K/N] [--threads N] [--seeds N|A,B,...] [--tune] [--no-plots] [--plugin DLL]... [--quiet]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "sweep", ["--out", "--shard", "--threads", "--seeds", "--plugin"], ["--tune", "--no-plots", "--quiet", "--force"]);
        a.RequirePositional(1, Usage);
        var sweep = SweepLoader.Load(a.Positional[0], Plugins.Registry(a.Options("--plugin")), ScoreCatalog.All.Select(s => s.Key).ToList());
        foreach (string w in sweep.Scenarios.SelectMany(x => x.Warnings).Distinct()) StandardOutput.Error.WriteLine($"warning: {w}");
        if (a.Option("--seeds") is { } seedsText)
        {
            sweep = sweep with
            {
                Scenarios = sweep.Scenarios.Select(x => x with { Simulation = x.Simulation with { Seeds = Runs.SeedSet.ParseOption(seedsText, x.Simulation.Seed) } }).ToList(),
            };
        }
        int threads = a.Threads(DefaultThreads(sweep));
        if (a.Flag("--tune")) return Tune(sweep, a, threads);

        var all = SweepPlanner.Cases(sweep);
        var (shard, count, source) = ShardOption.Resolve(a.Option("--shard"), System.Environment.GetEnvironmentVariable);
        var mine = SweepPlanner.Shard(all, shard, count);
        string output = a.Option("--out") ?? Path.Combine("results", count == 1 ? $"sweep-{sweep.Name}" : $"sweep-{sweep.Name}-shard-{shard}-of-{count}");
        string digest = SweepStore.Digest(all);
        OpenSweepFolder(output, sweep, mine, shard, count, source, a.Flag("--force"));
        SweepStore.WriteManifest(output, new SweepManifest
        {
            Schema = SweepManifest.SchemaId, Name = sweep.Name, SweepDigest = digest, Inputs = SweepPlanner.Inputs(sweep), TotalCases = all.Count, Shard = shard, ShardCount = count,
            ShardCases = mine.Count, Objective = sweep.ObjectiveScore, HeatmapX = sweep.HeatmapX, HeatmapY = sweep.HeatmapY,
        });
        var done = SweepStore.ReadAll(output);
        var todo = mine.Where(c => !done.ContainsKey(c.Id)).ToList();
        StandardOutput.Out.WriteLine($"{sweep.Name}: {all.Count} cases in all; shard {shard}/{count} ({source}) has {mine.Count}, {mine.Count - todo.Count} already done, running {todo.Count} on {threads} threads");
        using (var interruption = new Interruption())
        {
            try
            {
                Run(sweep, todo, threads, output, a.Flag("--quiet"), interruption.Token);
            }
            catch (OperationCanceledException)
            {
                int kept = SweepStore.ReadAll(output).Count(kv => mine.Any(c => c.Id == kv.Key));
                StandardOutput.Error.WriteLine($"interrupted by {interruption.SignalName}: {kept} of {mine.Count} cases of this shard are complete in {output}; run the same command again to resume with the rest");
                return interruption.ExitCode;
            }
        }

        if (count == 1)
        {
            var results = SweepStore.ReadAll(output).Values.Where(r => mine.Any(c => c.Id == r.CaseId)).ToList();
            SweepReport.Write(output, results, sweep.ObjectiveScore, sweep.HeatmapX, sweep.HeatmapY, !a.Flag("--no-plots"));
            OutputMarker.Describe(output, "sweep", [SweepStore.CasesFolderName]).Write(output);
            if (!a.Flag("--quiet")) StandardOutput.Out.Write(File.ReadAllText(Path.Combine(output, "best.md")));
        }
        else
        {
            StandardOutput.Out.WriteLine($"shard done; join the shards with: mppt-arena merge <shard folders...> --out DIR");
        }
        StandardOutput.Out.WriteLine($"results: {output}");
        var failed = SweepStore.ReadAll(output).Values.Where(r => r.Failed && mine.Any(c => c.Id == r.CaseId)).OrderBy(r => r.CaseId, StringComparer.Ordinal).ToList();
        if (failed.Count == 0) return ExitCodes.Ok;
        StandardOutput.Error.WriteLine($"{failed.Count} of {mine.Count} cases had a tracker that failed (first: case {failed[0].CaseId}: {failed[0].FailureReason}); see cases.csv");
        return ExitCodes.GateFailed;
    }

    /// <summary>
    /// Worker threads when --threads is not given: one per core, or one per two cores when a tracker runs in a
    /// host process. An isolated case keeps two threads busy (the arena's and the host's, which waits for the
    /// next call by spinning briefly), so more workers than half the cores only make pairs fight over cores:
    /// on two cores, 32 demo cases with the C P&amp;O took 3.9-5.0 s on one worker and 4.7-5.7 s on two.
    /// </summary>
    private static int DefaultThreads(SweepDefinition sweep) =>
        sweep.Trackers.Any(t => t.Descriptor.Isolation == MpptArena.Trackers.Isolation.IsolationMode.Process)
            ? Math.Max(1, System.Environment.ProcessorCount / 2)
            : System.Environment.ProcessorCount;

    /// <summary>
    /// A sweep writes its cases in place so that it can resume: a folder of the same sweep and shard is
    /// resumed, and when an input changed since (a scenario, a CSV it reads, a tracker's code, the tool) the
    /// cases it affects have new identities and run again while the stale ones are removed; a new or empty
    /// folder is started; another sweep's folder or an earlier arena output is replaced only with --force;
    /// anything else is refused before a case runs.
    /// </summary>
    internal static void OpenSweepFolder(string output, SweepDefinition sweep, IReadOnlyList<SweepCase> mine, int shard, int count, string source, bool force, string kind = "sweep")
    {
        string full = OutputTarget.FullPath(output);
        var inputs = SweepPlanner.Inputs(sweep);
        var marker = Directory.Exists(full) ? OutputMarker.Read(full) : null;
        if (marker is not null && marker.Kind == kind && marker.FirstForeignEntry(full) is null && File.Exists(Path.Combine(full, "sweep.json")))
        {
            var existing = SweepStore.ReadManifest(output);
            if (existing.Name == sweep.Name && existing.Shard == shard && existing.ShardCount == count)
            {
                if (!existing.Inputs.SequenceEqual(inputs))
                {
                    var ids = mine.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
                    int stale = SweepStore.RemoveExcept(output, ids);
                    StandardOutput.Out.WriteLine($"{output}: {SweepStore.DescribeChange(existing, inputs)} since it was written; {stale} case result(s) they affect were removed and run again");
                }
                return;
            }
            if (!force)
            {
                throw new ArenaInputException($"'{output}' holds another sweep or sharding ({existing.Name}, shard {existing.Shard}/{existing.ShardCount}; this is {sweep.Name}, shard {shard}/{count} from {source}); add --force to start this one there, or choose another --out", "--out");
            }
            Directory.Delete(full, recursive: true);
        }
        else if (OutputTarget.Check(full, force) == OutputTargetState.ArenaOutput)
        {
            Directory.Delete(full, recursive: true);
        }
        Directory.CreateDirectory(full);
        new OutputMarker { Schema = OutputMarker.SchemaId, Kind = kind, ToolVersion = SummaryBuilder.ToolVersion, Files = ["sweep.json"], Folders = [SweepStore.CasesFolderName] }.Write(full);
    }

    internal static void Run(SweepDefinition sweep, IReadOnlyList<SweepCase> todo, int threads, string output, bool quiet, CancellationToken cancel)
    {
        if (todo.Count == 0) return;
        if (quiet || !ConsoleMode.Interactive)
        {
            var lines = quiet ? null : new ProgressLines($"{todo.Count} cases");
            int finished = 0;
            SweepExecutor.RunAll(sweep, todo, threads, (c, r) =>
            {
                SweepStore.Write(output, SweepStore.ToResult(c, r));
                lines?.Report((double)Interlocked.Increment(ref finished) / todo.Count);
            }, cancel);
            return;
        }
        AnsiConsole.Progress()
            .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn(), new RemainingTimeColumn())
            .Start(ctx =>
            {
                var task = ctx.AddTask($"{todo.Count} cases", maxValue: todo.Count);
                SweepExecutor.RunAll(sweep, todo, threads, (c, r) =>
                {
                    SweepStore.Write(output, SweepStore.ToResult(c, r));
                    task.Increment(1);
                }, cancel);
            });
    }

    private static int Tune(SweepDefinition sweep, ArgumentReader a, int threads)
    {
        var tune = sweep.Tune ?? throw new ArenaInputException("--tune needs a 'tune' section in the sweep file", "tune");
        using var stage = StagedOutput.Begin(a.Option("--out") ?? Path.Combine("results", $"tune-{sweep.Name}"), "tune", a.Flag("--force"), numberIfTaken: a.Option("--out") is null);
        var tracker = sweep.Trackers.First(t => t.Name == tune.TrackerName);
        var declared = tune.Parameters.Select(p => tracker.Descriptor.Parameters.First(d => d.Name == p)).ToList();
        // Search box: the sweep's own range of a parameter when it sweeps it, else its declared range.
        var min = declared.Select(p => tracker.Axes.FirstOrDefault(x => x.Name == p.Name)?.Min ?? p.Min).ToList();
        var max = declared.Select(p => tracker.Axes.FirstOrDefault(x => x.Name == p.Name)?.Max ?? p.Max).ToList();
        var start = declared.Select((p, k) => Math.Clamp(tracker.Fixed.GetValueOrDefault(p.Name, p.Default), min[k], max[k])).ToList();
        var baseParameters = tracker.Fixed.Where(kv => !tune.Parameters.Contains(kv.Key))
            .Concat(tracker.Axes.Where(x => !tune.Parameters.Contains(x.Name) && x.Name != "period_ms").Select(x => KeyValuePair.Create(x.Name, x.Values[0])))
            .ToDictionary(kv => kv.Key, kv => kv.Value);
        double period = tracker.Axes.FirstOrDefault(x => x.Name == "period_ms")?.Values[0] ?? tracker.PeriodMs;
        int evaluation = 0;
        double Objective(IReadOnlyList<double> values)
        {
            var parameters = new Dictionary<string, double>(baseParameters);
            for (int k = 0; k < values.Count; k++) parameters[tune.Parameters[k]] = values[k];
            var sorted = parameters.OrderBy(kv => kv.Key, StringComparer.Ordinal).ToList();
            // One case per scenario, or per scenario and seed; a scenario's score is its mean over its seeds.
            var cases = sweep.Scenarios.SelectMany((_, i) => SweepPlanner.CasesOf(sweep, i, tracker, period, sorted)).ToList();
            var caseScores = new double[cases.Count];
            var index = cases.Select((c, k) => (c, k)).ToDictionary(x => x.c.Id, x => x.k);
            SweepExecutor.RunAll(sweep, cases, threads, (c, r) =>
            {
                var t = r.Trackers.Single();
                double? v = t.Scores is null ? null : ScoreCatalog.ToDictionary(t.Scores).GetValueOrDefault(tune.Score);
                caseScores[index[c.Id]] = v ?? (tune.Maximise ? double.NegativeInfinity : double.PositiveInfinity);
            });
            var scores = cases.Select((c, k) => (c.ScenarioIndex, Score: caseScores[k])).GroupBy(x => x.ScenarioIndex).OrderBy(g => g.Key)
                .Select(g => g.Average(x => x.Score)).ToArray();
            double aggregate = tune.WorstCase ? (tune.Maximise ? scores.Min() : scores.Max()) : scores.Average();
            evaluation++;
            if (!a.Flag("--quiet"))
            {
                StandardOutput.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"evaluation {evaluation}: {string.Join(", ", tune.Parameters.Select((p, k) => $"{p}={values[k]:G6}"))} -> {tune.Score} {aggregate:G6}"));
            }
            double f = tune.Maximise ? -aggregate : aggregate;
            return double.IsFinite(f) ? f : 1e30;
        }
        var (best, bestObjective, history) = ParameterTuner.Minimise(Objective, min, max, start, tune.MaxEvaluations);
        string output = stage.StagingPath;
        double bestScore = tune.Maximise ? -bestObjective : bestObjective;
        var doc = new
        {
            tracker = tracker.Name,
            score = tune.Score,
            goal = tune.Maximise ? "maximise" : "minimise",
            over = tune.WorstCase ? "worst" : "mean",
            best = tune.Parameters.Select((p, k) => new { name = p, value = best[k] }),
            best_score = bestScore,
            evaluations = history.Select(h => new { values = h.Values, score = tune.Maximise ? -h.Objective : h.Objective }),
        };
        File.WriteAllText(Path.Combine(output, "tune.json"), JsonSerializer.Serialize(doc, new JsonSerializerOptions { WriteIndented = true }) + "\n");
        var md = new StringBuilder($"# Tuning {tracker.Name}\n\n");
        int seedCount = sweep.Scenarios.Max(x => x.Simulation.SeedList.Count);
        string seedText = seedCount > 1 ? $" (each scenario's score the mean over its {seedCount} seeds)" : " (one seed: one draw of the sensor noise; --seeds N averages over N)";
        md.Append(CultureInfo.InvariantCulture, $"{(tune.Maximise ? "Maximised" : "Minimised")} the {(tune.WorstCase ? "worst" : "mean")} `{tune.Score}` over {sweep.Scenarios.Count} scenario(s){seedText} with Nelder-Mead (MathNet.Numerics), {history.Count} evaluations.\n\n");
        md.Append("| parameter | best | searched from | to |\n|---|---:|---:|---:|\n");
        for (int k = 0; k < best.Count; k++) md.Append(CultureInfo.InvariantCulture, $"| {tune.Parameters[k]} | {best[k]:G6} | {min[k]:G6} | {max[k]:G6} |\n");
        md.Append(CultureInfo.InvariantCulture, $"\nBest {tune.Score}: {bestScore:G6}\n");
        File.WriteAllText(Path.Combine(output, "tune.md"), md.ToString());
        StandardOutput.Out.Write(md.ToString());
        StandardOutput.Out.WriteLine($"results: {ShownPath.Of(stage.Commit())}");
        return ExitCodes.Ok;
    }
}
