using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Tests.Scenarios;

public class ScenarioErrorTests
{
    private static ArenaInputException Fails(string yaml) =>
        Assert.Throws<ArenaInputException>(() => ScenarioLoader.Parse(yaml, "bad.yaml", TrackerRegistry.WithBuiltIns()));

    private static int LineOf(string yaml, string text) =>
        yaml.Split('\n').Select((l, i) => (l, i)).First(x => x.l.Contains(text)).i + 1;

    [Fact]
    public void UnknownKeyIsReportedWithItsLineAndTheKeysExpected()
    {
        string yaml = TestScenarios.Yaml(extra: "colour: red");
        var e = Fails(yaml);
        Assert.Equal(LineOf(yaml, "colour: red"), e.Location!.Line);
        Assert.Equal(1, e.Location.Column);
        Assert.Contains("unknown key 'colour'", e.Message);
        Assert.Contains("expected one of", e.Message);
        Assert.StartsWith($"bad.yaml:{e.Location.Line}:1:", e.Message);
    }

    [Fact]
    public void PeriodThatIsNotAWholeNumberOfPlantStepsIsRefused()
    {
        string yaml = TestScenarios.Yaml(trackers: "- { name: po, type: perturb_observe, period_ms: 2.5 }", simulation: "duration_s: 1\n  plant_step_us: 1000");
        var e = Fails(yaml);
        Assert.Equal(LineOf(yaml, "period_ms: 2.5"), e.Location!.Line);
        Assert.Contains("not a whole number of plant steps", e.Message);
    }

    [Fact]
    public void WrongTypeIsReportedAtTheValue()
    {
        string yaml = TestScenarios.Yaml(simulation: "duration_s: soon\n  plant_step_us: 100");
        var e = Fails(yaml);
        Assert.Equal(LineOf(yaml, "duration_s: soon"), e.Location!.Line);
        Assert.Equal(15, e.Location.Column);
        Assert.Contains("is not a number", e.Message);
    }

    [Fact]
    public void MissingRequiredKeyNamesTheKeyAndItsSection()
    {
        var e = Fails(TestScenarios.Yaml(simulation: "plant_step_us: 100"));
        Assert.Contains("missing required key 'duration_s' in 'scenario.simulation'", e.Message);
        Assert.NotNull(e.Location);
    }

    [Theory]
    [InlineData("input_capacitance_uf: 0")]
    [InlineData("input_capacitance_uf: -220")]
    [InlineData("inductance_mh: -1")]
    public void ZeroOrNegativePhysicalQuantitiesAreRefused(string line)
    {
        string yaml = TestScenarios.Yaml(converter: $"type: boost\n  {line}");
        var e = Fails(yaml);
        Assert.Contains("greater than zero", e.Message);
        Assert.Equal(LineOf(yaml, line), e.Location!.Line);
    }

    [Fact]
    public void TimeSeriesThatGoBackwardsAreRefused()
    {
        string yaml = TestScenarios.Yaml(environment: "irradiance_w_m2:\n    - start: 800\n    - points: [[0, 800], [5, 600], [3, 700]]\n  cell_temperature_c: 25");
        var e = Fails(yaml);
        Assert.Contains("time goes backwards", e.Message);
        Assert.Equal(LineOf(yaml, "points:"), e.Location!.Line);
    }

    [Fact]
    public void ShadingOfASubstringThatDoesNotExistIsRefused()
    {
        string yaml = TestScenarios.Yaml(environment: "irradiance_w_m2: 900\n  cell_temperature_c: 25\n  shading:\n    - { substrings: [ { string: 1, module: 11, substring: 1 } ], transmittance: 0.5 }");
        var e = Fails(yaml);
        Assert.Contains("module 11 does not exist: the array has 10 modules per string", e.Message);
        Assert.Equal(LineOf(yaml, "module: 11"), e.Location!.Line);
    }

    [Fact]
    public void UnknownTrackerTypeListsTheKnownOnes()
    {
        var e = Fails(TestScenarios.Yaml(trackers: "- { name: x, type: magic_tracker }"));
        Assert.Contains("unknown tracker type 'magic_tracker'", e.Message);
        Assert.Contains("perturb_observe", e.Message);
    }

    [Fact]
    public void TrackerParameterOutsideItsDeclaredRangeIsRefused()
    {
        var e = Fails(TestScenarios.Yaml(trackers: "- { name: x, type: perturb_observe, parameters: { step_v: -2 } }"));
        Assert.Contains("step_v", e.Message);
        Assert.Contains("out of range", e.Message);
    }

    [Fact]
    public void BrokenYamlIsReportedWithItsPosition()
    {
        var e = Fails("name: x\nmodule: { datasheet: [\n");
        Assert.Contains("not valid YAML", e.Message);
        Assert.NotNull(e.Location);
    }

    [Fact]
    public void ImpossibleDatasheetIsReportedAtTheField()
    {
        string yaml = TestScenarios.Yaml().Replace("mpp_voltage_v: 31.4", "mpp_voltage_v: 39.0");
        var e = Fails(yaml);
        Assert.Contains("must be below open_circuit_voltage_v", e.Message);
        Assert.Equal(LineOf(yaml, "mpp_voltage_v: 39.0"), e.Location!.Line);
    }

    [Fact]
    public void EveryBundledScenarioLoads()
    {
        // Examples run as tests so that they cannot rot (the demo itself runs in the CLI tests).
        string dir = Path.Combine(RepoRoot.Path, "scenarios");
        var files = Directory.GetFiles(dir, "*.yaml");
        Assert.NotEmpty(files);
        foreach (string f in files.Where(f => !f.Contains("plant-", StringComparison.Ordinal)))
        {
            var s = ScenarioLoader.Load(f, TrackerRegistry.WithBuiltIns());
            Assert.NotEmpty(s.Trackers);
        }
    }

    [Fact]
    public void AnOversizedFileIsRefusedBeforeItIsRead()
    {
        // A limit of the tool itself (YamlInput.MaxFileBytes): an input that could exhaust memory is refused at 1:1.
        string file = Path.Combine(Path.GetTempPath(), $"mppt-arena-big-{Guid.NewGuid():N}.yaml");
        using (var f = File.Create(file)) f.SetLength(YamlInput.MaxFileBytes + 1);
        try
        {
            var e = Assert.Throws<ArenaInputException>(() => ScenarioLoader.Load(file, TrackerRegistry.WithBuiltIns()));
            Assert.Contains("the limit is 16 MiB", e.Message);
            Assert.Equal((1L, 1L), (e.Location!.Line, e.Location.Column));
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public void PlantsThatCannotTrackAreRefusedWithTheFixNamed()
    {
        // A boost steps up only and a buck steps down only (Erickson, Maksimovic, Fundamentals of Power
        // Electronics, 2nd ed., 2001, ch. 2): V_pv = (1 - D) V_bus for the boost, V_batt = D V_pv for the buck.
        var boost = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(TestScenarios.Yaml(converter: "type: boost\n  bus_voltage_v: 250")));
        Assert.Contains("not above the array's MPP voltage at STC", boost.Message);
        var buck = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(TestScenarios.Yaml(converter: "type: buck\n  battery_voltage_v: 400")));
        Assert.Contains("not below the array's MPP voltage at STC", buck.Message);
        var adc = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(TestScenarios.Yaml(sensors: "voltage: { bits: 16, full_scale_v: 300 }\n  current: { bits: 16, full_scale_a: 12 }")));
        Assert.Contains("full_scale_v to at least", adc.Message);
        Assert.All(new[] { boost, buck, adc }, e => Assert.NotNull(e.Location));
    }
}
