using MpptArena.Reports.Summary;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Tests.Runs;

public class RunTests
{
    private static string NoisyBoost(string seed, string? step = "200") => TestScenarios.Yaml(
        converter: "type: boost\n  bus_voltage_v: 700",
        environment: "irradiance_w_m2:\n    - start: 900\n    - hold_s: 0.5\n    - ramp: { to: 500, rate_per_s: 400 }\n    - hold_s: 0.5\n  cell_temperature_c: 40",
        trackers: "- { name: po, type: perturb_observe, period_ms: 10 }\n- { name: inc, type: incremental_conductance, period_ms: 10 }",
        simulation: step is null ? $"duration_s: 2.5\n  seed: {seed}" : $"duration_s: 2.5\n  plant_step_us: {step}\n  seed: {seed}",
        sensors: "voltage: { bits: 12, full_scale_v: 500, noise_rms_v: 0.5 }\n  current: { bits: 12, full_scale_a: 12, noise_rms_a: 0.02 }");

    private static string SummaryText(RunResult r) => SummaryJson.Serialize(SummaryBuilder.Build(r));

    [Fact]
    public void SameSeedGivesBitIdenticalResultsAndAnotherSeedDiffers()
    {
        string a = SummaryText(TestScenarios.Run(NoisyBoost("11")));
        string b = SummaryText(TestScenarios.Run(NoisyBoost("11")));
        string c = SummaryText(TestScenarios.Run(NoisyBoost("12")));
        Assert.Equal(a, b);
        Assert.NotEqual(a, c);
    }

    [Fact]
    public void ConstantConditionsAreSimulatedExactlyAsStated()
    {
        // A constant 1000 W/m2, 25 degC sky: the run must score against the exact solve's MPP at those
        // conditions (a grid value such as 24.8 degC is 0.08 % of MPP power away: about -0.4 %/K, common
        // practice for crystalline silicon); the prepared curve's own power error is below 5e-5.
        var sink = new ListSink();
        var yaml = TestScenarios.Yaml(simulation: "duration_s: 0.2\n  plant_step_us: 100\n  seed: 3");
        TestScenarios.Run(yaml, _ => sink);
        var scenario = TestScenarios.Parse(yaml);
        var exact = scenario.Array.Solve(scenario.Array.UniformConditions(1000, 25));
        var mpp = MpptArena.Arrays.MppSearch.RefineOnExact(MpptArena.Arrays.MppSearch.FindPeaks(new MpptArena.Arrays.PreparedArrayCurve(exact)), exact).Global;
        Assert.NotEmpty(sink.Rows);
        Assert.All(sink.Rows, r => Assert.Equal(mpp.PowerW, r.MppPowerW, mpp.PowerW * 5e-5));
    }

    [Theory]
    [InlineData(100, 0.9, 1.0)]
    [InlineData(1000, 0.0, 0.05)]
    public void BoostRunsReportTheirTimeInDiscontinuousConduction(double irradianceWm2, double low, double high)
    {
        // At 20 kHz with 2 mH the 10-module string's boost leaves CCM below about 230 W/m2 (the average current
        // falls under half the ripple, V D Ts / (2 L); Erickson and Maksimovic 2001, ch. 5).
        var sink = new ListSink();
        var yaml = TestScenarios.Yaml(converter: "type: boost\n  switching_frequency_khz: 20",
            environment: $"irradiance_w_m2: {irradianceWm2}\n  cell_temperature_c: 25",
            simulation: "duration_s: 2\n  seed: 3");
        var run = TestScenarios.Run(yaml, _ => sink);
        double share = run.Trackers[0].DiscontinuousTimeS!.Value / run.DurationS;
        Assert.InRange(share, low, high);
        Assert.All(sink.Rows, r =>
        {
            Assert.InRange(r.DutyCycle, 0.0, 0.95);
            Assert.InRange(r.DiscontinuousShare, 0.0, 1.0);
            Assert.True(r.InductorCurrentA >= 0);
        });
        // The boost's inductor carries the array current: on average over the last second they agree.
        var late = sink.Rows.Where(r => r.TimeS > 1).ToList();
        Assert.Equal(late.Average(r => r.CurrentA), late.Average(r => r.InductorCurrentA), 0.01 * late.Average(r => r.CurrentA));
    }

    [Fact]
    public void AScanDownToTheBatteryVoltageKeepsTheBuckPlantFiniteAndWithinTheAvailableEnergy()
    {
        // A scan that sweeps the buck's PV voltage down to the battery voltage drives the DCM on-interval
        // voltage (v - E) to zero, where the DCM pole 2 V_off / (d1 Ts V_on) grows without bound (Sun et al.,
        // IEEE TPEL 16(4), 2001). Energy conservation: no tracker takes more than the MPP offers.
        // The bundled buck charger under its cloud, with the scan tracker a tuning sweep gives it.
        string file = Path.Combine(RepoRoot.Path, "scenarios", "buck-charger-cloud.yaml");
        var lines = File.ReadAllLines(file).Where(l => !l.TrimStart().StartsWith("- { name:")).ToList();
        lines.Insert(lines.FindIndex(l => l.StartsWith("trackers:")) + 1,
            "  - { name: scan, type: periodic_scan, period_ms: 20, parameters: { scan_interval_s: 2, scan_points: 40 } }");
        var scenario = ScenarioLoader.Parse(string.Join("\n", lines), file, TrackerRegistry.WithBuiltIns());
        var scores = new ScenarioRunner().Run(scenario).Trackers[0].Scores!;
        Assert.True(double.IsFinite(scores.EnergyWh), $"energy {scores.EnergyWh}");
        Assert.InRange(scores.TrackingEfficiency, 0.5, 1.0);
    }

    [Fact]
    public void HalvingThePlantStepChangesRunEnergyByLessThanOneTenthOfAPercent()
    {
        // Convergence of the integrator at the default step (1 ms for the boost: exponential steps) against
        // half of it and against a tenth of it.
        var coarse = TestScenarios.Run(NoisyBoost("5", null));
        Assert.Equal(1e-3, coarse.PlantStepS, 12);
        var half = TestScenarios.Run(NoisyBoost("5", "500"));
        var fine = TestScenarios.Run(NoisyBoost("5", "100"));
        for (int k = 0; k < coarse.Trackers.Count; k++)
        {
            double e1 = coarse.Trackers[k].Scores!.EnergyWh, e2 = half.Trackers[k].Scores!.EnergyWh, e3 = fine.Trackers[k].Scores!.EnergyWh;
            Assert.True(Math.Abs(e1 - e2) / e2 < 1e-3, $"{coarse.Trackers[k].Name}: {e1:F6} Wh at 1 ms, {e2:F6} Wh at 500 us");
            Assert.True(Math.Abs(e1 - e3) / e3 < 1e-3, $"{coarse.Trackers[k].Name}: {e1:F6} Wh at 1 ms, {e3:F6} Wh at 100 us");
        }
    }

    [Fact]
    public void BuckDefaultStepConvergesToo()
    {
        // The buck keeps RK4 (its loop is not linear in the state): default 200 us against 100 us.
        string Buck(string? step) => NoisyBoost("5", step).Replace("type: boost\n  bus_voltage_v: 700", "type: buck\n  battery_voltage_v: 200");
        var coarse = TestScenarios.Run(Buck(null));
        Assert.Equal(200e-6, coarse.PlantStepS, 12);
        var fine = TestScenarios.Run(Buck("100"));
        for (int k = 0; k < coarse.Trackers.Count; k++)
        {
            double e1 = coarse.Trackers[k].Scores!.EnergyWh, e2 = fine.Trackers[k].Scores!.EnergyWh;
            Assert.True(Math.Abs(e1 - e2) / e2 < 1e-3, $"{coarse.Trackers[k].Name}: {e1:F6} Wh at 200 us, {e2:F6} Wh at 100 us");
        }
    }

    [Fact]
    public void IdealSourceDefaultStepOfATrackerPeriodConverges()
    {
        // Default for the ideal source: the step is the tracker period (10 ms here) and the environment is
        // evaluated as often; against 1 ms steps with the same environment step, and 100 us.
        string Ideal(string simulation) => NoisyBoost("5", null)
            .Replace("type: boost\n  bus_voltage_v: 700", "type: ideal_source\n  lag_time_constant_ms: 2")
            .Replace("duration_s: 2.5\n  seed: 5", simulation);
        var coarse = TestScenarios.Run(Ideal("duration_s: 2.5\n  seed: 5"));
        Assert.Equal(10e-3, coarse.PlantStepS, 12);
        var fine = TestScenarios.Run(Ideal("duration_s: 2.5\n  seed: 5\n  plant_step_us: 1000\n  environment_step_ms: 10"));
        var finer = TestScenarios.Run(Ideal("duration_s: 2.5\n  seed: 5\n  plant_step_us: 100\n  environment_step_ms: 10"));
        for (int k = 0; k < coarse.Trackers.Count; k++)
        {
            double e1 = coarse.Trackers[k].Scores!.EnergyWh, e2 = fine.Trackers[k].Scores!.EnergyWh, e3 = finer.Trackers[k].Scores!.EnergyWh;
            Assert.True(Math.Abs(e1 - e2) / e2 < 1e-3, $"{coarse.Trackers[k].Name}: {e1:F6} Wh at 10 ms, {e2:F6} Wh at 1 ms");
            Assert.True(Math.Abs(e1 - e3) / e3 < 1e-3, $"{coarse.Trackers[k].Name}: {e1:F6} Wh at 10 ms, {e3:F6} Wh at 100 us");
        }
    }

    [Theory]
    [InlineData("boost", new[] { 10.0, 15.0 }, 1000.0)]
    [InlineData("boost", new[] { 2.5 }, 500.0)] // with the 1 ms environment step: gcd 0.5 ms
    [InlineData("boost", new[] { 0.5, 20.0 }, 500.0)]
    [InlineData("buck", new[] { 10.0 }, 200.0)]
    public void DefaultStepDividesEveryTrackerPeriod(string converter, double[] periodsMs, double expectedUs)
    {
        var kind = converter == "buck" ? MpptArena.Plant.FrontEndKind.Buck : MpptArena.Plant.FrontEndKind.Boost;
        double step = SimulationSettings.DefaultPlantStepS(kind, periodsMs.Select(p => p * 1e-3).Append(1e-3));
        Assert.Equal(expectedUs, step * 1e6, 6);
        foreach (double p in periodsMs) Assert.True(SimulationSettings.IsWholeNumberOfSteps(p * 1e-3, step));
    }

    [Fact]
    public void ATinyInputCapacitorIsIntegratedStablyBySubstepping()
    {
        // A 1 uF input capacitor against the array's near-open-circuit conductance makes the fastest mode far
        // quicker than a 50 us step; the runner must split the step rather than blow up.
        var yaml = NoisyBoost("3").Replace("type: boost", "type: boost\n  input_capacitance_uf: 1");
        var scenario = TestScenarios.Parse(yaml);
        Assert.True(ScenarioRunner.SubstepsFor(scenario, scenario.Simulation.PlantStepS) > 1);
        var result = new ScenarioRunner().Run(scenario);
        foreach (var t in result.Trackers)
        {
            Assert.Null(t.Failure);
            Assert.InRange(t.Scores!.TrackingEfficiency, 0.5, 1.0);
        }
    }

    [Fact]
    public void ATrackerThatMisbehavesIsStoppedAndTheOthersCarryOn()
    {
        // Contract (IMpptTracker): a command outside the converter's range stops that tracker only.
        var scenario = TestScenarios.Parse(TestScenarios.Yaml(trackers: "- { name: po, type: perturb_observe, period_ms: 10 }"));
        var throwing = new MpptArena.Trackers.TrackerDescriptor("throwing", "", "", [], _ => new ThrowingTracker());
        scenario = scenario with
        {
            Trackers = [.. scenario.Trackers, new TrackerSpec("thrower", throwing, new MpptArena.Trackers.TrackerSettings([], new Dictionary<string, double>()), 0.01)],
        };
        var result = new ScenarioRunner().Run(scenario);
        Assert.Null(result.Trackers.Single(t => t.Name == "po").Failure);
        Assert.True(result.Trackers.Single(t => t.Name == "po").Scores!.TrackingEfficiency > 0.95);
        var thrower = result.Trackers.Single(t => t.Name == "thrower");
        Assert.Contains("InvalidOperationException", thrower.Failure!.Reason);
        Assert.Null(thrower.Scores);
    }

    private sealed class ThrowingTracker : MpptArena.Trackers.IMpptTracker
    {
        private int _calls;
        public MpptArena.Trackers.TrackerCommandKind CommandKind => MpptArena.Trackers.TrackerCommandKind.VoltageReference;
        public double Reset(MpptArena.Trackers.TrackerContext context) => 300;
        public double Step(in MpptArena.Trackers.TrackerMeasurement measurement) =>
            ++_calls > 5 ? throw new InvalidOperationException("deliberate") : 300;
    }
}
