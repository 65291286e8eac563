using System.Collections.Concurrent;
using MpptArena.Scenarios;

namespace MpptArena.Runs;

/// <summary>
/// Runs a scenario once per seed of <see cref="SimulationSettings.SeedList"/>: each run is the scenario with that
/// seed alone, so the result of one seed does not depend on which other seeds run, in which order, or on how
/// many threads.
/// </summary>
public static class MultiSeedRunner
{
    /// <summary>Runs every seed; results in the order of the seed list. Series sinks serve the first seed only.</summary>
    /// <param name="scenario">The scenario.</param>
    /// <param name="sinkFor">Series sink per tracker for the first seed, or null for none.</param>
    /// <param name="progress">Receives the finished fraction over all seeds [0, 1], or null.</param>
    /// <param name="cancel">Stops every run between steps.</param>
    /// <param name="logFor">Where each tracker's own output goes, for every seed, or null to drop it.</param>
    /// <param name="threads">Seeds run at once; user code that runs in process (sharing its globals between
    /// instances) always runs one seed at a time.</param>
    public static IReadOnlyList<RunResult> Run(Scenario scenario, Func<TrackerSpec, ISeriesSink?>? sinkFor = null, IProgress<double>? progress = null,
        CancellationToken cancel = default, Func<TrackerSpec, TextWriter?>? logFor = null, int threads = 1)
    {
        var seeds = scenario.Simulation.SeedList;
        var runner = new ScenarioRunner();
        if (seeds.Count == 1) return [runner.Run(WithSeed(scenario, seeds[0]), sinkFor, progress, cancel, logFor)];

        // One synchronised writer per tracker log, shared by the seeds that run at once.
        var logs = new ConcurrentDictionary<string, TextWriter?>(StringComparer.Ordinal);
        Func<TrackerSpec, TextWriter?>? sharedLog = logFor is null ? null
            : spec => logs.GetOrAdd(spec.Name, _ => logFor(spec) is { } w ? TextWriter.Synchronized(w) : null);
        var fractions = new double[seeds.Count];
        var results = new RunResult[seeds.Count];
        bool inProcessUserCode = scenario.Trackers.Any(t => t.Descriptor.IsUserCodeInProcess);
        var options = new ParallelOptions { MaxDegreeOfParallelism = inProcessUserCode ? 1 : Math.Max(1, threads), CancellationToken = cancel };
        Parallel.For(0, seeds.Count, options, k =>
        {
            var seedProgress = progress is null ? null : new SeedProgress(fractions, k, progress);
            results[k] = runner.Run(WithSeed(scenario, seeds[k]), k == 0 ? sinkFor : null, seedProgress, cancel, sharedLog);
        });
        return results;
    }

    /// <summary>The scenario with one seed and no seed list.</summary>
    public static Scenario WithSeed(Scenario scenario, ulong seed) =>
        scenario with { Simulation = scenario.Simulation with { Seed = seed, Seeds = null } };

    private sealed class SeedProgress(double[] fractions, int index, IProgress<double> total) : IProgress<double>
    {
        public void Report(double value)
        {
            double sum;
            lock (fractions)
            {
                fractions[index] = value;
                sum = fractions.Sum();
            }
            total.Report(sum / fractions.Length);
        }
    }
}
