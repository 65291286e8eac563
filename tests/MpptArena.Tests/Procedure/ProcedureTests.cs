using MpptArena.Procedure;
using MpptArena.Pv;
using MpptArena.Reports.Procedure;
using MpptArena.Reports.Sweeps;
using MpptArena.Sweeps;
using MpptArena.Tests.Cli;
using MpptArena.Trackers;

namespace MpptArena.Tests.Procedure;

public class ProcedureTests
{
    [Theory]
    // Curve shapes of the procedure's test array (EN 50530 annex, from memory): crystalline silicon Vmpp/Voc 0.80,
    // Impp/Isc 0.90; thin film 0.72 and 0.80.
    [InlineData("crystalline_silicon", 3000, 300, 0.80, 0.90)]
    [InlineData("crystalline_silicon", 150, 250, 0.80, 0.90)]
    [InlineData("crystalline_silicon", 10000, 700, 0.80, 0.90)]
    [InlineData("thin_film", 3000, 300, 0.72, 0.80)]
    [InlineData("thin_film", 250, 480, 0.72, 0.80)]
    public void TheTestArrayHasTheShapeAndTheRatedPointAtStc(string shapeName, double powerW, double mppVoltageV, double vRatio, double iRatio)
    {
        var array = ProcedureTestArray.Build(ProcedureTable.ShapeNamed(shapeName)!, powerW, mppVoltageV);
        var module = array.Module.Reference;
        int m = array.Layout.ModulesPerString;
        var mpp = SingleDiodeModel.MaximumPowerPoint(module);
        double voc = SingleDiodeModel.OpenCircuitVoltageV(module) * m, isc = SingleDiodeModel.ShortCircuitCurrentA(module);
        Assert.Equal(powerW, mpp.PowerW * m, powerW * 1e-6);
        Assert.Equal(mppVoltageV, mpp.VoltageV * m, mppVoltageV * 1e-6);
        Assert.Equal(vRatio, mpp.VoltageV * m / voc, 1e-6);
        Assert.Equal(iRatio, mpp.CurrentA / isc, 1e-6);
    }

    private const string Plant = """
        name: cv-procedure
        module:
          datasheet: { short_circuit_current_a: 9.5, open_circuit_voltage_v: 38.2, mpp_current_a: 8.95, mpp_voltage_v: 31.0, cells_in_series: 60,
                       isc_temperature_coefficient_a_per_k: 0.0045, voc_temperature_coefficient_v_per_k: -0.135 }
        array: { substrings_per_module: 3, modules_per_string: 10, strings: 1 }
        converter: { type: ideal_source, lag_time_constant_ms: 1 }
        sensors:
          voltage: { bits: 16, full_scale_v: 500 }
          current: { bits: 16, full_scale_a: 20 }
        environment: { irradiance_w_m2: 1000, cell_temperature_c: 25 }
        simulation: { duration_s: 1, seed: 3 }
        trackers:
          - { name: cv, type: constant_voltage, period_ms: 20, parameters: { fraction: 0.76 } }
        procedure:
          rated_power_w: 3000
          mpp_voltage_v: { min: 200, rated: 300, max: 360 }
          test_array: thin_film
          stabilisation_s: 1
          measurement_s: 2
          dynamic: false
          start_up_shut_down: false
        """;

    [Fact]
    public void WeightedEfficienciesOfAConstantVoltageTrackerAreTheWeightsAppliedByHand()
    {
        // A constant-voltage tracker holds V = 0.76 Voc(STC) of each point's test array; the ideal source has settled
        // long before the measurement, so each static efficiency is P(V) / Pmpp on the exact single-diode curve
        // (computed here independently from the fitted module), and the weighted efficiencies are the European
        // weights 0.03, 0.06, 0.13, 0.10, 0.48, 0.20 and the CEC weights 0.04, 0.05, 0.12, 0.21, 0.53, 0.05 (from
        // memory of EN 50530 and the CEC rule) applied to them by hand.
        string dir = CliProcess.TempFolder();
        string file = Path.Combine(dir, "plant.yaml");
        File.WriteAllText(file, Plant);
        var (plant, settings) = ProcedureLoader.Load(file, TrackerRegistry.WithBuiltIns());
        var points = ProcedurePlan.Points(plant, settings);
        Assert.Equal(24, points.Count);
        var tracker = plant.Trackers[0];
        var sweep = new SweepDefinition(plant.Name, points.Select(p => p.Scenario).ToList(),
            [new SweepTracker(tracker.Name, tracker.Descriptor, tracker.Settings.All.ToDictionary(kv => kv.Key, kv => kv.Value), [], 20)],
            new SweepSampling(SweepSamplingMethod.Grid), "tracking_efficiency", null, null, null);
        var results = new List<SweepCaseResult>();
        SweepExecutor.RunAll(sweep, SweepPlanner.Cases(sweep), 2, (c, r) => { lock (results) results.Add(SweepStore.ToResult(c, r)); });
        var report = ProcedureReport.Collect(points, SweepReport.Sorted(results)).Single();

        double Expected(double level, double voltage)
        {
            var array = ProcedureTestArray.Build(ProcedureTable.ThinFilm, level * 3000, voltage);
            var p = array.Module.Reference;
            int m = array.Layout.ModulesPerString;
            double vModule = 0.76 * SingleDiodeModel.OpenCircuitVoltageV(p);
            return vModule * SingleDiodeModel.CurrentAtVoltage(p, vModule) / SingleDiodeModel.MaximumPowerPoint(p).PowerW;
        }
        foreach (double v in new[] { 200.0, 300.0, 360.0 })
        {
            foreach (var s in report.Static.Where(s => s.MppVoltageV == v)) Assert.Equal(Expected(s.Level, v), s.Efficiency!.Value, 2e-4);
            double european = 0.03 * Expected(0.05, v) + 0.06 * Expected(0.10, v) + 0.13 * Expected(0.20, v) + 0.10 * Expected(0.30, v) + 0.48 * Expected(0.50, v) + 0.20 * Expected(1.00, v);
            double cec = 0.04 * Expected(0.10, v) + 0.05 * Expected(0.20, v) + 0.12 * Expected(0.30, v) + 0.21 * Expected(0.50, v) + 0.53 * Expected(0.75, v) + 0.05 * Expected(1.00, v);
            Assert.Equal(european, report.European[v]!.Value, 2e-4);
            Assert.Equal(cec, report.Cec[v]!.Value, 2e-4);
            // Weights applied to the measured static efficiencies reproduce the report exactly.
            double At(double level) => report.Static.Single(s => s.MppVoltageV == v && Math.Abs(s.Level - level) < 1e-9).Efficiency!.Value;
            Assert.Equal(0.03 * At(0.05) + 0.06 * At(0.10) + 0.13 * At(0.20) + 0.10 * At(0.30) + 0.48 * At(0.50) + 0.20 * At(1.00), report.European[v]!.Value, 1e-12);
        }
        Assert.True(Expected(0.5, 300) < 0.995, "0.76 Voc is off the thin-film MPP (0.72 Voc), so the check is not trivially 1");
    }

    [Fact]
    public void TheProcedureCommandRunsResumesAndRefusesABadSection()
    {
        string dir = CliProcess.TempFolder();
        File.WriteAllText(Path.Combine(dir, "plant.yaml"), Plant.Replace("dynamic: false", "dynamic: true\n  max_slopes: 1"));
        var (exit, output, err) = CliProcess.Run(dir, "procedure", "plant.yaml", "--out", "proc", "--quiet");
        Assert.True(exit == 0, err);
        Assert.True(File.Exists(Path.Combine(dir, "proc", "procedure.md")));
        Assert.True(File.Exists(Path.Combine(dir, "proc", "procedure-static.png")));
        Assert.Contains("26 operating points", output);
        var again = CliProcess.Run(dir, "procedure", "plant.yaml", "--out", "proc", "--quiet");
        Assert.Equal(0, again.Exit);
        Assert.Contains("26 already done, running 0", again.Out);

        File.WriteAllText(Path.Combine(dir, "bad.yaml"), Plant.Replace("min: 200, rated: 300", "min: 320, rated: 300"));
        var bad = CliProcess.Run(dir, "procedure", "bad.yaml", "--out", "proc2");
        Assert.Equal(2, bad.Exit);
        Assert.Contains("bad.yaml:", bad.Err);
        Assert.Contains("min <= rated <= max", bad.Err);
        Assert.False(Directory.Exists(Path.Combine(dir, "proc2")));
    }
}
