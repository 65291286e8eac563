using MpptArena.Cli.Terminal;
using MpptArena.Procedure;
using MpptArena.Reports.Output;
using MpptArena.Reports.Procedure;
using MpptArena.Reports.Sweeps;
using MpptArena.Sweeps;

namespace MpptArena.Cli.Commands;

/// <summary>
/// mppt-arena procedure FILE.yaml: the MPPT efficiency test procedure (static points, weighted efficiencies, ramp
/// sequences, start-up and shut-down) on the user's converter, run in parallel over its points and resumable.
/// </summary>
internal static class ProcedureCommand
{
    public const string Usage = "mppt-arena procedure FILE.yaml [--tracker NAME]... [--out DIR] [--force] [--threads N] [--seeds N|A,B,...] [--no-plots] [--plugin DLL]... [--quiet]";

    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "procedure", ["--tracker", "--out", "--threads", "--seeds", "--plugin"], ["--no-plots", "--quiet", "--force"]);
        a.RequirePositional(1, Usage);
        var (plant, settings) = ProcedureLoader.Load(a.Positional[0], Plugins.Registry(a.Options("--plugin")));
        foreach (string w in plant.Warnings) StandardOutput.Error.WriteLine($"warning: {w}");
        var names = a.Options("--tracker");
        foreach (string n in names.Where(n => plant.Trackers.All(t => t.Name != n)))
        {
            throw new ArenaInputException($"--tracker '{n}' is not in the file; it has: {string.Join(", ", plant.Trackers.Select(t => t.Name))}", "--tracker");
        }
        if (names.Count > 0) plant = plant with { Trackers = plant.Trackers.Where(t => names.Contains(t.Name)).ToList() };
        if (a.Option("--seeds") is { } seedsText) plant = plant with { Simulation = plant.Simulation with { Seeds = Runs.SeedSet.ParseOption(seedsText, plant.Simulation.Seed) } };
        int threads = a.Threads(System.Environment.ProcessorCount);

        var points = ProcedurePlan.Points(plant, settings);
        var trackers = plant.Trackers.Select(t => new SweepTracker(t.Name, t.Descriptor, t.Settings.All.ToDictionary(kv => kv.Key, kv => kv.Value), [], t.SamplePeriodS * 1e3) { Limits = t.Limits }).ToList();
        var sweep = new SweepDefinition(plant.Name, points.Select(p => p.Scenario).ToList(), trackers, new SweepSampling(SweepSamplingMethod.Grid),
            "tracking_efficiency", null, null, null);
        var cases = SweepPlanner.Cases(sweep);
        string output = a.Option("--out") ?? Path.Combine("results", $"procedure-{plant.Name}");
        SweepCommand.OpenSweepFolder(output, sweep, cases, 1, 1, "whole procedure", a.Flag("--force"), kind: "procedure");
        SweepStore.WriteManifest(output, new SweepManifest
        {
            Schema = SweepManifest.SchemaId, Name = sweep.Name, SweepDigest = SweepStore.Digest(cases), Inputs = SweepPlanner.Inputs(sweep), TotalCases = cases.Count, Shard = 1, ShardCount = 1,
            ShardCases = cases.Count, Objective = sweep.ObjectiveScore,
        });
        var done = SweepStore.ReadAll(output);
        var todo = cases.Where(c => !done.ContainsKey(c.Id)).ToList();
        double simulated = cases.Sum(c => sweep.Scenarios[c.ScenarioIndex].Simulation.DurationS);
        StandardOutput.Out.WriteLine(FormattableString.Invariant(
            $"{sweep.Name}: {points.Count} operating points x {trackers.Count} tracker(s){(plant.Simulation.IsMultiSeed ? $" x {plant.Simulation.SeedList.Count} seeds" : "")} = {cases.Count} runs ({simulated / 3600:0.#} h simulated); {cases.Count - todo.Count} already done, running {todo.Count} on {threads} threads"));
        using (var interruption = new Interruption())
        {
            try
            {
                SweepCommand.Run(sweep, todo, threads, output, a.Flag("--quiet"), interruption.Token);
            }
            catch (OperationCanceledException)
            {
                int kept = SweepStore.ReadAll(output).Count(kv => cases.Any(c => c.Id == kv.Key));
                StandardOutput.Error.WriteLine($"interrupted by {interruption.SignalName}: {kept} of {cases.Count} runs are complete in {output}; run the same command again to resume with the rest");
                return interruption.ExitCode;
            }
        }
        var ids = cases.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        var results = SweepReport.Sorted(SweepStore.ReadAll(output).Values.Where(r => ids.Contains(r.CaseId)));
        var report = ProcedureReport.Collect(points, results);
        ProcedureReport.Write(output, plant.Name, settings, report, !a.Flag("--no-plots"));
        OutputMarker.Describe(output, "procedure", [SweepStore.CasesFolderName]).Write(output);
        if (!a.Flag("--quiet")) StandardOutput.Out.Write(File.ReadAllText(Path.Combine(output, "procedure.md")));
        StandardOutput.Out.WriteLine($"results: {ShownPath.Of(output)}");
        var failed = results.Where(r => r.Failed).ToList();
        if (failed.Count == 0) return ExitCodes.Ok;
        StandardOutput.Error.WriteLine($"{failed.Count} of {cases.Count} runs had a tracker that failed (first: {failed[0].Tracker} at {failed[0].Scenario}: {failed[0].FailureReason})");
        return ExitCodes.GateFailed;
    }
}
