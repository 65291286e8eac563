using MpptArena.Runs;

namespace MpptArena.Tests.Trackers;

public class TrackerBehaviourTests
{
    [Fact]
    public void PerturbAndObserveCyclesThroughThreeLevelsAtSteadyState()
    {
        // Source: Femia, Petrone, Spagnuolo, Vitelli, IEEE Trans. Power Electronics 20(4), 2005: a well-tuned
        // P&O (sample period longer than the settling of the PV voltage, no noise) settles into the three-level
        // cycle Vmpp - dV, Vmpp, Vmpp + dV with period 4 T.
        var sink = new ListSink();
        var yaml = TestScenarios.Yaml(
            trackers: "- { name: po, type: perturb_observe, period_ms: 20, parameters: { step_v: 2, start_fraction: 0.7 } }",
            simulation: "duration_s: 6\n  plant_step_us: 100\n  seed: 3\n  series_interval_ms: 20",
            sensors: "voltage: { bits: 24, full_scale_v: 500 }\n  current: { bits: 24, full_scale_a: 12 }");
        TestScenarios.Run(yaml, _ => sink);
        var commands = sink.Rows.Where(r => r.TimeS > 4.0).Select(r => Math.Round(r.Command, 6)).ToList();
        var levels = commands.Distinct().OrderBy(v => v).ToList();
        Assert.Equal(3, levels.Count);
        Assert.Equal(2.0, levels[1] - levels[0], 1e-6);
        Assert.Equal(2.0, levels[2] - levels[1], 1e-6);
        for (int k = 4; k < commands.Count; k++) Assert.Equal(commands[k - 4], commands[k]);
        double vmpp = sink.Rows[^1].MppVoltageV;
        Assert.InRange(levels[1], vmpp - 2.0, vmpp + 2.0);
    }

    private const string TwoPeakShade = """
        irradiance_w_m2: 1000
          cell_temperature_c: 25
          shading:
            - { modules: [ {string: 1, module: 1}, {string: 1, module: 2}, {string: 1, module: 3}, {string: 1, module: 4}, {string: 1, module: 5}, {string: 1, module: 6} ], transmittance: 0.5 }
        """;

    [Fact]
    public void ScanTrackerFindsTheGlobalPeakWhereAPerturbAndObserveStartedLowStaysOnTheLowerOne()
    {
        // 18 of 30 substrings at half light: the global maximum is the high-voltage hill (all substrings
        // conducting at the shaded current), the lower one the low-voltage hill of the 12 lit substrings.
        var yaml = TestScenarios.Yaml(environment: TwoPeakShade,
            trackers: """
                - { name: po, type: perturb_observe, period_ms: 20, parameters: { step_v: 2, start_fraction: 0.05 } }
                - { name: scan, type: periodic_scan, period_ms: 20, parameters: { scan_interval_s: 30, step_v: 2 } }
                """,
            simulation: "duration_s: 8\n  plant_step_us: 100\n  seed: 3");
        var result = TestScenarios.Run(yaml);
        var po = result.Trackers.Single(t => t.Name == "po").Scores!;
        var scan = result.Trackers.Single(t => t.Name == "scan").Scores!;
        Assert.True(po.MultiPeakTimeS > 7.9);
        Assert.True(po.GlobalPeakTimeShare < 0.05, $"P&O on the global hill {po.GlobalPeakTimeShare:P1} of the time");
        Assert.True(scan.GlobalPeakTimeShare > 0.85, $"scan on the global hill {scan.GlobalPeakTimeShare:P1} of the time");
        Assert.True(scan.TrackingEfficiency > po.TrackingEfficiency + 0.1);
    }

    [Fact]
    public void ConstantVoltageEfficiencyOnARampEqualsTheValueComputedFromTheModelDirectly()
    {
        // Hand computation from the single-diode model (De Soto 2006) outside the plant: the ideal source
        // holds the array at Vc; energy = integral of Vc I(Vc, G(t)) dt and available = integral of
        // Pmpp(G(t)) dt by Simpson's rule on the module model (uniform light: the string is N equal modules).
        const double duration = 10, g0 = 300, g1 = 900, fraction = 0.7;
        var yaml = TestScenarios.Yaml(
            environment: $"irradiance_w_m2:\n    - start: {g0}\n    - ramp: {{ to: {g1}, over_s: {duration} }}\n  cell_temperature_c: 25",
            trackers: $"- {{ name: cv, type: constant_voltage, period_ms: 10, parameters: {{ fraction: {fraction} }} }}",
            simulation: $"duration_s: {duration}\n  plant_step_us: 100\n  reprepare_irradiance_w_m2: 0.2",
            sensors: "voltage: { bits: 24, full_scale_v: 500 }\n  current: { bits: 24, full_scale_a: 12 }",
            modulesPerString: "4");
        var scenario = TestScenarios.Parse(yaml);
        var result = new ScenarioRunner().Run(scenario);
        var module = scenario.Array.Module;
        double vocModule = MpptArena.Pv.SingleDiodeModel.OpenCircuitVoltageV(module.Reference);
        double vc = fraction * vocModule; // per module; the string holds 4
        const int n = 400;
        double energy = 0, available = 0;
        for (int k = 0; k <= n; k++)
        {
            double w = k == 0 || k == n ? 1 : k % 2 == 1 ? 4 : 2;
            double g = g0 + (g1 - g0) * k / n;
            var p = module.At(g, 25);
            energy += w * vc * MpptArena.Pv.SingleDiodeModel.CurrentAtVoltage(p, vc);
            available += w * MpptArena.Pv.SingleDiodeModel.MaximumPowerPoint(p).PowerW;
        }
        double expected = energy / available;
        Assert.Equal(expected, result.Trackers[0].Scores!.TrackingEfficiency, 1e-3);
    }
}
