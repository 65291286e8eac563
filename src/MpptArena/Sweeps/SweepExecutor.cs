using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Sweeps;

/// <summary>
/// Runs sweep cases in parallel. Each case is an independent, seeded run, so results do not depend on
/// the number of threads or the order of completion; callers sort what they aggregate.
/// </summary>
public static class SweepExecutor
{
    /// <summary>The scenario of a case: the suite's scenario with only the case's tracker (and, where the scenario leaves the plant step out, a step chosen for its period).</summary>
    public static Scenario ScenarioFor(SweepDefinition sweep, SweepCase c)
    {
        var tracker = sweep.Trackers.First(t => t.Name == c.TrackerName);
        var settings = new TrackerSettings(tracker.Descriptor.Parameters, c.Parameters.ToDictionary(kv => kv.Key, kv => kv.Value));
        var spec = new TrackerSpec(c.TrackerName, tracker.Descriptor, settings, c.PeriodMs * 1e-3) { Limits = tracker.Limits };
        var scenario = sweep.Scenarios[c.ScenarioIndex];
        scenario = Runs.MultiSeedRunner.WithSeed(scenario, c.Seed ?? scenario.Simulation.Seed);
        return scenario with { Trackers = [spec], Simulation = scenario.Simulation.WithStepsFor(scenario.Converter.Kind, [spec.SamplePeriodS]) };
    }

    /// <summary>Runs one case.</summary>
    public static RunResult Run(SweepDefinition sweep, SweepCase c, CancellationToken cancel = default) => new ScenarioRunner().Run(ScenarioFor(sweep, c), cancel: cancel);

    /// <summary>Runs <paramref name="cases"/> on up to <paramref name="threads"/> threads, calling <paramref name="finished"/> as each completes (from any thread).</summary>
    public static void RunAll(SweepDefinition sweep, IReadOnlyList<SweepCase> cases, int threads, Action<SweepCase, RunResult> finished, CancellationToken cancel = default)
    {
        var options = new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, threads), CancellationToken = cancel };
        Parallel.ForEach(cases, options, c => finished(c, Run(sweep, c, cancel)));
    }
}
