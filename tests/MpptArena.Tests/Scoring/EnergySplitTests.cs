using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Tests.Scoring;

public class EnergySplitTests
{
    public static TheoryData<string> BundledScenarios()
    {
        var data = new TheoryData<string>();
        foreach (string f in Directory.GetFiles(Path.Combine(RepoRoot.Path, "scenarios"), "*.yaml").Order(StringComparer.Ordinal))
        {
            if (File.ReadAllText(f).Contains("\ntrackers:")) data.Add(Path.GetFileName(f));
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(BundledScenarios))]
    public void PartsAddUpToTheEnergyLostOnEveryBundledScenario(string file)
    {
        // By construction each plant step's loss is booked to one part; the test holds the sum to the loss
        // (available minus taken, each summed over the run) within 1e-9 relative.
        var scenario = ScenarioLoader.Load(Path.Combine(RepoRoot.Path, "scenarios", file), TrackerRegistry.WithBuiltIns());
        var run = new ScenarioRunner().Run(scenario);
        foreach (var t in run.Trackers)
        {
            var s = t.Scores!;
            Assert.Equal(s.EnergyLostWh, s.EnergySplit.TotalWh, Math.Abs(s.EnergyLostWh) * 1e-9);
            Assert.Equal(s.EnergySplit, t.EnergySplit);
            Assert.All(s.EnergySplit.Parts, p => Assert.True(p.Wh > -1e-6 * s.AvailableEnergyWh, $"{t.Name} {p.Key} {p.Wh}"));
            Assert.Equal(0, s.EnergySplit.AfterFailureWh);
        }
    }

    /// <summary>Perturb and observe that stops perturbing while the power changes by less than its dead band: the stalling tracker of the test.</summary>
    private sealed class DeadBandPerturbAndObserve : IMpptTracker
    {
        private double _v, _p, _step = 3;
        public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;
        public double Reset(TrackerContext c) => _v = 0.8 * c.NominalOpenCircuitVoltageV;

        public double Step(in TrackerMeasurement m)
        {
            double p = m.PowerW, dp = p - _p;
            _p = p;
            if (Math.Abs(dp) < 40) return _v;      // dead band in W: a firmware "good enough" that never lets go
            if (dp < 0) _step = -_step;
            return _v += _step;
        }
    }

    /// <summary>Fails with an exception from <paramref name="failS"/> on.</summary>
    private sealed class FailingTracker(double failS) : IMpptTracker
    {
        public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;
        public double Reset(TrackerContext c) => 0.8 * c.NominalOpenCircuitVoltageV;
        public double Step(in TrackerMeasurement m) => m.TimeS >= failS ? throw new InvalidOperationException("gave up") : m.PreviousCommand;
    }

    private static Scenario WithTestKinds(string yaml)
    {
        var registry = TrackerRegistry.WithBuiltIns();
        registry.Register(new TrackerDescriptor("dead_band_po", "test", "test", [], _ => new DeadBandPerturbAndObserve()));
        registry.Register(new TrackerDescriptor("fails_at_1s", "test", "test", [], _ => new FailingTracker(1.0)));
        return ScenarioLoader.Parse(yaml, "test.yaml", registry);
    }

    [Fact]
    public void ADeadBandTrackerIsFlaggedAsStalledAndAHealthyPerturbAndObserveIsNot()
    {
        // The cells warm from 25 to 65 degC: the MPP voltage falls by about 0.4 %/K x 40 K = 16 % (common practice
        // for crystalline silicon), well past the 5 % stall fraction, while the dead-band tracker holds still.
        var scenario = WithTestKinds(TestScenarios.Yaml(
            environment: "irradiance_w_m2: 900\n  cell_temperature_c:\n    - start: 25\n    - hold_s: 3\n    - ramp: { to: 65, over_s: 20 }\n    - hold_s: 3",
            trackers: "- { name: po, type: perturb_observe, period_ms: 20 }\n- { name: stuck, type: dead_band_po, period_ms: 20 }",
            simulation: "duration_s: 26\n  plant_step_us: 1000\n  seed: 3"));
        var run = new ScenarioRunner().Run(scenario);
        var po = run.Trackers.Single(t => t.Name == "po");
        var stuck = run.Trackers.Single(t => t.Name == "stuck");
        Assert.False(po.Stall!.Stalled);
        Assert.True(stuck.Stall!.Stalled);
        Assert.InRange(stuck.Stall.FirstStallS!.Value, 3, 15);
        Assert.True(stuck.Stall.StallTimeS > 5, $"stalled {stuck.Stall.StallTimeS} s");
        Assert.True(stuck.Stall.StallEnergyLostWh > 0);
    }

    [Fact]
    public void AFailedTrackerLosesEverythingAvailableAfterItsFailure()
    {
        // Constant 1000 W/m2: after the failure at t = 1 s nothing is taken, so the part after failure is the MPP
        // power times the rest of the run, and the parts still add up to available minus taken.
        var scenario = WithTestKinds(TestScenarios.Yaml(
            trackers: "- { name: po, type: perturb_observe, period_ms: 20 }\n- { name: quits, type: fails_at_1s, period_ms: 20 }",
            simulation: "duration_s: 3\n  plant_step_us: 1000\n  seed: 3"));
        var run = new ScenarioRunner().Run(scenario);
        var quits = run.Trackers.Single(t => t.Name == "quits");
        var po = run.Trackers.Single(t => t.Name == "po");
        Assert.NotNull(quits.Failure);
        Assert.Null(quits.Scores);
        double mppW = po.Scores!.AvailableEnergyWh * 3600 / run.DurationS;
        double failS = quits.Failure!.TimeS;
        Assert.Equal(mppW * (run.DurationS - failS) / 3600, quits.EnergySplit!.AfterFailureWh, 1e-9);
        Assert.True(quits.EnergySplit.TotalWh > quits.EnergySplit.AfterFailureWh);
    }
}
