using System.Text.Json;
using MpptArena.Reports.Summary;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Tests.Schemas;

public class SchemaTests
{
    private static object? Yaml(string text)
    {
        var stream = new YamlStream();
        stream.Load(new StringReader(text));
        return MiniSchemaValidator.FromYaml(stream.Documents[0].RootNode);
    }

    [Fact]
    public void EveryBundledScenarioMatchesTheShippedScenarioSchema()
    {
        var validator = MiniSchemaValidator.Load(Path.Combine(RepoRoot.Path, "scenarios", "scenario.schema.json"));
        var files = Directory.GetFiles(Path.Combine(RepoRoot.Path, "scenarios"), "*.yaml").Where(f => !Path.GetFileName(f).StartsWith("plant-"))
            .Concat(Directory.GetFiles(Path.Combine(RepoRoot.Path, "examples"), "scenario.yaml", SearchOption.AllDirectories));
        foreach (string file in files)
        {
            Assert.True(validator.Validate(Yaml(File.ReadAllText(file))), $"{file}: {string.Join("; ", validator.Errors)}");
        }
    }

    [Fact]
    public void TheSchemaRejectsWhatTheLoaderRejects()
    {
        var validator = MiniSchemaValidator.Load(Path.Combine(RepoRoot.Path, "scenarios", "scenario.schema.json"));
        Assert.False(validator.Validate(Yaml(TestScenarios.Yaml(extra: "colour: red"))));
        Assert.False(MiniSchemaValidator.Load(Path.Combine(RepoRoot.Path, "scenarios", "scenario.schema.json"))
            .Validate(Yaml(TestScenarios.Yaml(converter: "type: flyback"))));
        Assert.True(MiniSchemaValidator.Load(Path.Combine(RepoRoot.Path, "scenarios", "scenario.schema.json"))
            .Validate(Yaml(TestScenarios.Yaml())));
    }

    [Fact]
    public void SummaryJsonMatchesTheShippedSummarySchema()
    {
        var run = TestScenarios.Run(TestScenarios.Yaml(
            environment: "irradiance_w_m2:\n    - start: 100\n    - en50530_ramps: { range: high, max_slopes: 1, dwell_s: 1 }\n  cell_temperature_c: 25",
            trackers: "- { name: po, type: perturb_observe, period_ms: 10 }",
            simulation: "plant_step_us: 500\n  reprepare_irradiance_w_m2: 5"));
        string json = SummaryJson.Serialize(SummaryBuilder.Build(run));
        var validator = MiniSchemaValidator.Load(Path.Combine(RepoRoot.Path, "docs", "summary.schema.json"));
        Assert.True(validator.Validate(MiniSchemaValidator.FromJson(JsonDocument.Parse(json).RootElement)), string.Join("; ", validator.Errors));
        Assert.Contains("window:en50530_high", json);
    }
}
