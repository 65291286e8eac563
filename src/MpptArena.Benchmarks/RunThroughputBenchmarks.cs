using BenchmarkDotNet.Attributes;
using MpptArena.Arrays;
using MpptArena.Plant;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Benchmarks;

/// <summary>
/// Whole runs with one perturb-and-observe tracker (10 ms period) on the 2 x 10 x 3 array, to read off
/// the ratio of simulated time to wall time, curve re-preparation included: the EN 50530 steepest
/// low-range block and the moving-shadow demo, in converter (boost) and ideal-source mode, and the same
/// block on one string behind a 20 kHz boost, in discontinuous conduction below about 230 W/m2. The reference
/// is a straightforward RK4 loop at 50 us over the exact nested solve, timed over a short span.
/// </summary>
[MemoryDiagnoser]
public class RunThroughputBenchmarks
{
    private Scenario _rampBoost = null!, _rampIdeal = null!, _shadowBoost = null!, _shadowIdeal = null!, _blockBoost = null!, _blockIdeal = null!, _blockLowLight = null!;
    private PvArray _array = null!;
    private ExactArrayCurve _exact = null!;

    /// <summary>Simulated seconds per run of the scenario benchmarks.</summary>
    public const double SimulatedS = 20;

    /// <summary>Simulated seconds per run of the reference loop.</summary>
    public const double ReferenceSimulatedS = 0.01;

    [GlobalSetup]
    public void Setup()
    {
        string root = FindRoot();
        var registry = TrackerRegistry.WithBuiltIns();
        var demo = ScenarioLoader.Load(Path.Combine(root, "scenarios", "demo-moving-shadow.yaml"), registry);
        var ramps = ScenarioLoader.Load(Path.Combine(root, "scenarios", "en50530-low-ramps.yaml"), registry);
        // The target's array: two strings of ten modules.
        var layout = demo.Array.Layout with { StringsInParallel = 2 };
        var po = demo.Trackers.First(t => t.Descriptor.Kind == "perturb_observe") with { SamplePeriodS = 0.01 };
        Scenario Make(Scenario s, FrontEndKind kind, double stepS, double durationS = SimulatedS, int strings = 2) => s with
        {
            Array = s.Array with { Layout = layout with { StringsInParallel = strings } },
            Converter = demo.Converter with { Kind = kind, MaxVoltageReferenceV = 1000, SwitchingFrequencyHz = 20e3 },
            Sensors = demo.Sensors,
            Trackers = [po],
            Simulation = s.Simulation with { DurationS = durationS, PlantStepS = stepS, EnvironmentStepS = Math.Max(1e-3, stepS), SeriesIntervalS = 0 },
            Scoring = new Scoring.ScoringSettings(),
        };
        var rampScenario = LastBlock(ramps, 360);
        _rampBoost = Make(rampScenario, FrontEndKind.Boost, 1e-3);
        _rampIdeal = Make(rampScenario, FrontEndKind.IdealSource, 10e-3);
        _blockBoost = Make(rampScenario, FrontEndKind.Boost, 1e-3, 360);
        _blockIdeal = Make(rampScenario, FrontEndKind.IdealSource, 10e-3, 360);
        _blockLowLight = Make(rampScenario, FrontEndKind.Boost, 1e-3, 360, strings: 1);
        _shadowBoost = Make(demo, FrontEndKind.Boost, 1e-3, demo.Simulation.DurationS);
        _shadowIdeal = Make(demo, FrontEndKind.IdealSource, 10e-3, demo.Simulation.DurationS);
        _array = _shadowBoost.Array;
        _exact = _array.Solve(_array.UniformConditions(850, 40));
    }

    /// <summary>The ramp scenario with its profile shifted so that its last <paramref name="seconds"/> (the 50 W/m2/s block) run from t = 0.</summary>
    public static Scenario LastBlock(Scenario ramps, double seconds)
    {
        var profile = ramps.Environment.Irradiance;
        double blockStart = profile.EndTimeS - seconds;
        var shifted = new Environment.PiecewiseLinearProfile(
            profile.TimesS.Where(t => t >= blockStart).Select(t => t - blockStart).ToList(),
            profile.TimesS.Select((t, i) => (t, i)).Where(x => x.t >= blockStart).Select(x => profile.Values[x.i]).ToList());
        return ramps with { Environment = ramps.Environment with { Irradiance = shifted } };
    }

    /// <summary>The checkout's root (where MpptArena.sln is).</summary>
    public static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "MpptArena.sln"))) dir = dir.Parent;
        return dir?.FullName ?? Directory.GetCurrentDirectory();
    }

    [Benchmark(Description = "EN 50530 50 W/m2/s block, boost, first 20 s (up-ramp: every curve new)")]
    public RunResult RampBoost() => new ScenarioRunner().Run(_rampBoost);

    [Benchmark(Description = "EN 50530 50 W/m2/s block, ideal source, first 20 s")]
    public RunResult RampIdeal() => new ScenarioRunner().Run(_rampIdeal);

    [Benchmark(Description = "EN 50530 50 W/m2/s block, boost, whole block (360 s, ten cycles)")]
    public RunResult BlockBoost() => new ScenarioRunner().Run(_blockBoost);

    [Benchmark(Description = "EN 50530 50 W/m2/s block, one string, 20 kHz boost, whole block (360 s; DCM below about 230 W/m2)")]
    public RunResult BlockLowLight() => new ScenarioRunner().Run(_blockLowLight);

    [Benchmark(Description = "EN 50530 50 W/m2/s block, ideal source, whole block (360 s)")]
    public RunResult BlockIdeal() => new ScenarioRunner().Run(_blockIdeal);

    [Benchmark(Description = "moving shadow demo, boost, whole demo (60 s)")]
    public RunResult ShadowBoost() => new ScenarioRunner().Run(_shadowBoost);

    [Benchmark(Description = "moving shadow demo, ideal source, whole demo (60 s)")]
    public RunResult ShadowIdeal() => new ScenarioRunner().Run(_shadowIdeal);

    [Benchmark(Description = "reference: RK4 50 us on the exact solve, 10 ms simulated")]
    public double ReferenceLoop()
    {
        // Straightforward boost with its voltage loop, every derivative evaluating the exact nested solve.
        double c = 220e-6, l = 2e-3, r = 0.1, h = 50e-6, vref = 600;
        double kv = 2 * Math.PI * 100 * c, kc = 2 * Math.PI * 1000 * l;
        double v = _exact.OpenCircuitVoltageV, i = 0;
        for (int n = 0; n < (int)(ReferenceSimulatedS / h); n++)
        {
            double ipv = _exact.CurrentAtVoltage(v);
            double vOut = v - r * i - kc * (ipv + kv * (v - vref) - i);
            (double, double) F(double vv, double ii) => ((_exact.CurrentAtVoltage(vv) - ii) / c, (vv - vOut - r * ii) / l);
            var (a1, b1) = F(v, i);
            var (a2, b2) = F(v + 0.5 * h * a1, i + 0.5 * h * b1);
            var (a3, b3) = F(v + 0.5 * h * a2, i + 0.5 * h * b2);
            var (a4, b4) = F(v + h * a3, i + h * b3);
            v += h / 6 * (a1 + 2 * a2 + 2 * a3 + a4);
            i = Math.Max(0, i + h / 6 * (b1 + 2 * b2 + 2 * b3 + b4));
        }
        return v;
    }
}
