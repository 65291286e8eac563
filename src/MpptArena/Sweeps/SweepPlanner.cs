using MpptArena.Sensing;

namespace MpptArena.Sweeps;

/// <summary>Expands a sweep into its cases, in a fixed order, and partitions them into shards.</summary>
public static class SweepPlanner
{
    /// <summary>Every case of the sweep: for each tracker, each setting (grid or samples), each scenario.</summary>
    public static IReadOnlyList<SweepCase> Cases(SweepDefinition sweep)
    {
        var cases = new List<SweepCase>();
        for (int t = 0; t < sweep.Trackers.Count; t++)
        {
            var tracker = sweep.Trackers[t];
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var setting in Settings(tracker, sweep.Sampling, t))
            {
                // Sampling among choices can draw a setting twice; it is one case.
                if (!seen.Add(string.Join(",", setting.OrderBy(kv => kv.Key, StringComparer.Ordinal).Select(kv => $"{kv.Key}={kv.Value:R}")))) continue;
                double period = setting.TryGetValue("period_ms", out double p) ? p : tracker.PeriodMs;
                var parameters = tracker.Fixed.Concat(setting.Where(kv => kv.Key != "period_ms"))
                    .OrderBy(kv => kv.Key, StringComparer.Ordinal).ToList();
                for (int s = 0; s < sweep.Scenarios.Count; s++) cases.AddRange(CasesOf(sweep, s, tracker, period, parameters));
            }
        }
        var duplicate = cases.GroupBy(c => c.Id).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null)
        {
            throw new ArenaInputException($"the sweep names the same case twice ({duplicate.First().Key}); give trackers distinct names or settings", "trackers");
        }
        return cases;
    }

    /// <summary>The cases of one setting on one scenario: one, or one per seed when the scenario runs over several.</summary>
    public static IEnumerable<SweepCase> CasesOf(SweepDefinition sweep, int scenarioIndex, SweepTracker tracker, double periodMs, IReadOnlyList<KeyValuePair<string, double>> parameters)
    {
        var scenario = sweep.Scenarios[scenarioIndex];
        var c = new SweepCase(scenarioIndex, scenario.Name, tracker.Name, tracker.Descriptor.Kind, periodMs, parameters, InputDigestOf(scenario, tracker));
        if (!scenario.Simulation.IsMultiSeed) return [c];
        return scenario.Simulation.SeedList.Select(seed => c with { Seed = seed });
    }

    /// <summary>Digest of what a case's result depends on besides its settings: the tool build, the scenario's inputs, the tracker's code.</summary>
    public static string InputDigestOf(Scenarios.Scenario scenario, SweepTracker tracker) =>
        Scenarios.ContentDigest.OfParts([ArenaVersion.Build, scenario.InputDigest, tracker.Descriptor.CodeDigest ?? "built-in"]);

    /// <summary>
    /// The named inputs of a sweep and their digests ("tool", "scenario NAME", "tracker NAME"), so that a
    /// changed one can be named.
    /// </summary>
    public static SortedDictionary<string, string> Inputs(SweepDefinition sweep)
    {
        var d = new SortedDictionary<string, string>(StringComparer.Ordinal) { ["tool"] = ArenaVersion.Build };
        foreach (var s in sweep.Scenarios) d[$"scenario {s.Name}"] = s.InputDigest;
        foreach (var t in sweep.Trackers) d[$"tracker {t.Name}"] = t.Descriptor.CodeDigest ?? "built-in";
        return d;
    }

    /// <summary>The cases of shard <paramref name="shard"/> of <paramref name="shardCount"/> (1-based).</summary>
    public static IReadOnlyList<SweepCase> Shard(IReadOnlyList<SweepCase> cases, int shard, int shardCount) =>
        cases.Where(c => c.ShardOf(shardCount) == shard).ToList();

    private static IEnumerable<Dictionary<string, double>> Settings(SweepTracker tracker, SweepSampling sampling, int trackerIndex)
    {
        var axes = tracker.Axes;
        if (axes.Count == 0)
        {
            yield return [];
            yield break;
        }
        if (sampling.Method == SweepSamplingMethod.Grid)
        {
            var index = new int[axes.Count];
            while (true)
            {
                yield return axes.Select((a, k) => (a.Name, a.Values[index[k]])).ToDictionary(x => x.Name, x => x.Item2);
                int d = axes.Count - 1;
                while (d >= 0 && ++index[d] == axes[d].Values.Count) index[d--] = 0;
                if (d < 0) yield break;
            }
        }
        var random = new DeterministicRandom(DeterministicRandom.Derive(sampling.Seed, (ulong)trackerIndex + 1));
        int n = sampling.Count;
        if (sampling.Method == SweepSamplingMethod.Random)
        {
            for (int k = 0; k < n; k++) yield return axes.ToDictionary(a => a.Name, a => a.At(random.NextDouble()));
            yield break;
        }
        // Latin hypercube (M. D. McKay, R. J. Beckman, W. J. Conover, Technometrics 21(2), 1979):
        // a random permutation of the N strata per axis, a uniform point inside each stratum.
        var strata = axes.Select(_ => Permutation(n, random)).ToList();
        for (int k = 0; k < n; k++)
        {
            yield return axes.Select((a, j) => (a.Name, a.At((strata[j][k] + random.NextDouble()) / n))).ToDictionary(x => x.Name, x => x.Item2);
        }
    }

    private static int[] Permutation(int n, DeterministicRandom random)
    {
        var p = Enumerable.Range(0, n).ToArray();
        for (int i = n - 1; i > 0; i--)
        {
            int j = (int)(random.NextUInt64() % (ulong)(i + 1));
            (p[i], p[j]) = (p[j], p[i]);
        }
        return p;
    }
}
