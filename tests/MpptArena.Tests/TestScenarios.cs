using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Tests;

/// <summary>Scenario text for tests, with the parts a test varies passed in. The module is the invented 60-cell one.</summary>
internal static class TestScenarios
{
    public const string Module = """
        module:
          datasheet:
            short_circuit_current_a: 9.50
            open_circuit_voltage_v: 38.2
            mpp_current_a: 9.00
            mpp_voltage_v: 31.4
            cells_in_series: 60
            isc_temperature_coefficient_a_per_k: 0.0045
            voc_temperature_coefficient_v_per_k: -0.118
        """;

    public static string Yaml(
        string converter = "type: ideal_source\n  lag_time_constant_ms: 1",
        string environment = "irradiance_w_m2: 1000\n  cell_temperature_c: 25",
        string trackers = "- { name: po, type: perturb_observe, period_ms: 20 }",
        string simulation = "duration_s: 2\n  plant_step_us: 100\n  seed: 3",
        string sensors = "voltage: { bits: 16, full_scale_v: 500 }\n  current: { bits: 16, full_scale_a: 12 }",
        string modulesPerString = "10",
        string extra = "") => $"""
        name: test-case
        {Module}
        array:
          substrings_per_module: 3
          modules_per_string: {modulesPerString}
          strings: 1
        converter:
          {converter}
        sensors:
          {sensors}
        environment:
          {environment}
        simulation:
          {simulation}
        trackers:
          {trackers.Replace("\n", "\n  ")}
        {extra}
        """;

    public static Scenario Parse(string yaml) => ScenarioLoader.Parse(yaml, "test.yaml", TrackerRegistry.WithBuiltIns());

    public static RunResult Run(string yaml, Func<TrackerSpec, ISeriesSink?>? sinks = null) => new ScenarioRunner().Run(Parse(yaml), sinks);
}

/// <summary>Keeps series rows in memory for assertions.</summary>
internal sealed class ListSink : ISeriesSink
{
    public List<SeriesRow> Rows { get; } = [];

    public void Write(in SeriesRow row) => Rows.Add(row);

    public void Dispose() { }
}
