using BenchmarkDotNet.Attributes;
using MpptArena.Sweeps;
using MpptArena.Trackers;

namespace MpptArena.Benchmarks;

/// <summary>A fixed sweep run on one thread and on all cores: the ratio is the sweep's scaling.</summary>
public class SweepScalingBenchmarks
{
    private SweepDefinition _sweep = null!;
    private IReadOnlyList<SweepCase> _cases = null!;

    [Params(1, 2)]
    public int Threads { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "MpptArena.sln"))) dir = dir.Parent;
        string file = Path.Combine(dir!.FullName, "scenarios", "sweeps", "tuning-demo.yaml");
        _sweep = SweepLoader.Load(file, TrackerRegistry.WithBuiltIns());
        // The buck scenario only (shorter), P&O settings only: 15 cases.
        _cases = SweepPlanner.Cases(_sweep).Where(c => c.TrackerName == "po" && c.ScenarioName == "buck-charger-cloud").ToList();
    }

    [Benchmark(Description = "15 sweep cases")]
    public int Sweep()
    {
        int done = 0;
        SweepExecutor.RunAll(_sweep, _cases, Threads, (_, _) => Interlocked.Increment(ref done));
        return done;
    }
}
