using BenchmarkDotNet.Attributes;
using MpptArena.Arrays;
using MpptArena.Plant;
using MpptArena.Trackers;

namespace MpptArena.Benchmarks;

/// <summary>One plant step of each front end (no allocation allowed: see the Allocated column), and the
/// runner's overhead around a tracker call compared with calling the tracker directly.</summary>
[MemoryDiagnoser]
public class PlantStepBenchmarks
{
    private PreparedArrayCurve _curve = null!;
    private BoostFrontEnd _boost = null!;
    private IdealSourceFrontEnd _ideal = null!;
    private IMpptTracker _tracker = null!;
    private Runs.TrackerLane _lane = null!;
    private double _t;

    [GlobalSetup]
    public void Setup()
    {
        var array = BenchmarkArrays.TwoByTen();
        _curve = new PreparedArrayCurve(array.Solve(BenchmarkArrays.AllDifferent(array)));
        _boost = new BoostFrontEnd(new ConverterSettings(FrontEndKind.Boost));
        _boost.Reset(_curve.OpenCircuitVoltageV);
        _ideal = new IdealSourceFrontEnd(new ConverterSettings(FrontEndKind.IdealSource));
        _ideal.Reset(_curve.OpenCircuitVoltageV);
        _tracker = new ConstantCommand();
        _tracker.Reset(null!);
        var context = new TrackerContext(0.01, 0, 1000, 760, 19, 500.0 / 4096, 12.0 / 4096, 12, 12);
        var sensors = new Sensing.SensorSettings(Sensing.AdcChannelSettings.Ideal(1000), Sensing.AdcChannelSettings.Ideal(20));
        _lane = new Runs.TrackerLane
        {
            Spec = new Runs.TrackerSpec("probe", new TrackerDescriptor("probe", "", "", [], _ => new ConstantCommand()), new TrackerSettings([], new Dictionary<string, double>()), 0.01),
            Tracker = new ConstantCommand(),
            FrontEnd = _ideal,
            Sensors = new Sensing.SensorChain(sensors, 200, 50e-6, 1),
            Scorer = new Scoring.TrackerScorer(new Scoring.ScoringSettings()),
            Context = context,
            StepsPerSample = 200,
        };
        _lane.Command = 600;
    }

    [Benchmark(Description = "boost step, 1 ms, voltage reference (exponential closed loop, the default)")]
    public double BoostStep()
    {
        _boost.Step(1e-3, _curve, 600, TrackerCommandKind.VoltageReference);
        return _boost.PvVoltageV;
    }

    [Benchmark(Description = "boost step, 200 us, duty-cycle command (RK4)")]
    public double BoostDutyStep()
    {
        _boost.Step(200e-6, _curve, 0.2, TrackerCommandKind.DutyCycle);
        return _boost.PvVoltageV;
    }

    [Benchmark(Description = "ideal source step, 10 ms (a tracker period, the default)")]
    public double IdealStep()
    {
        _ideal.Step(10e-3, _curve, _t++ % 2 == 0 ? 600 : 603, TrackerCommandKind.VoltageReference);
        return _ideal.PvVoltageV;
    }

    [Benchmark(Baseline = true, Description = "tracker called directly")]
    public double DirectTrackerCall()
    {
        _t += 0.01;
        return _tracker.Step(new TrackerMeasurement(_t, 600, 8, 4915, 2730, 600, 4));
    }

    [Benchmark(Description = "tracker called through the runner's lane")]
    public double LaneTrackerCall()
    {
        _t += 0.01;
        _lane.Sample(new TrackerMeasurement(_t, 600, 8, 4915, 2730, 600, 4));
        return _lane.Command;
    }

    private sealed class ConstantCommand : IMpptTracker
    {
        public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;
        public double Reset(TrackerContext context) => 600;
        public double Step(in TrackerMeasurement m) => m.PreviousCommand;
    }
}
