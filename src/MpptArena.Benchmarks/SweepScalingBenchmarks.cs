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
        // The buck scenario only (shorter), the first 16 cases: an even count, so two threads can split the
        // work evenly (15 cases cap two threads at 15/8 = 1.875x whatever the code does).
        _cases = SweepPlanner.Cases(_sweep).Where(c => c.ScenarioName == "buck-charger-cloud").Take(16).ToList();
    }

    [Benchmark(Description = "16 sweep cases")]
    public int Sweep()
    {
        int done = 0;
        SweepExecutor.RunAll(_sweep, _cases, Threads, (_, _) => Interlocked.Increment(ref done));
        return done;
    }
}
