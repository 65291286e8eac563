namespace MpptArena.Reports.Summary;

/// <summary>
/// The contents of summary.json, schema <see cref="SchemaId"/> (docs/summary.schema.json). Key names are
/// stable: CI scripts read them. Everything in it is deterministic for a scenario and seed; machine-
/// dependent timings go to timing.json instead.
/// </summary>
public sealed record RunSummary
{
    /// <summary>Schema identifier written into every summary.</summary>
    public const string SchemaId = "mppt-arena/summary/1";

    /// <summary>Schema identifier.</summary>
    public required string Schema { get; init; }

    /// <summary>Version of the tool that wrote it.</summary>
    public required string ToolVersion { get; init; }

    /// <summary>The scenario scored.</summary>
    public required ScenarioInfo Scenario { get; init; }

    /// <summary>One entry per tracker, in scenario order.</summary>
    public required IReadOnlyList<TrackerSummary> Trackers { get; init; }

    /// <summary>Tracker names by tracking efficiency, best first; failed trackers last.</summary>
    public required IReadOnlyList<string> Ranking { get; init; }
}

/// <summary>Scenario identification in a summary.</summary>
public sealed record ScenarioInfo
{
    /// <summary>Scenario name.</summary>
    public required string Name { get; init; }

    /// <summary>Scenario description.</summary>
    public required string Description { get; init; }

    /// <summary>Seed.</summary>
    public required ulong Seed { get; init; }

    /// <summary>Digest of the plant description.</summary>
    public required string PlantDigest { get; init; }

    /// <summary>Simulated time [s].</summary>
    public required double DurationS { get; init; }

    /// <summary>Plant step [s].</summary>
    public required double PlantStepS { get; init; }

    /// <summary>Array curve preparations.</summary>
    public required int CurvePreparations { get; init; }
}

/// <summary>One tracker in a summary.</summary>
public sealed record TrackerSummary
{
    /// <summary>Name.</summary>
    public required string Name { get; init; }

    /// <summary>Kind.</summary>
    public required string Kind { get; init; }

    /// <summary>Sample period [s].</summary>
    public required double SamplePeriodS { get; init; }

    /// <summary>Parameter values.</summary>
    public required SortedDictionary<string, double> Parameters { get; init; }

    /// <summary>True if stopped for misbehaving.</summary>
    public required bool Failed { get; init; }

    /// <summary>Why, if failed.</summary>
    public string? FailureReason { get; init; }

    /// <summary>When, if failed [s].</summary>
    public double? FailureTimeS { get; init; }

    /// <summary>The last calls before the failure, oldest first; null if it did not fail.</summary>
    public IReadOnlyList<RecentCall>? FailureRecentCalls { get; init; }

    /// <summary>Tracker calls made.</summary>
    public required long TrackerCalls { get; init; }

    /// <summary>Share of the run the converter spent in discontinuous conduction [-]; null for the ideal source (and in summaries written before it was reported).</summary>
    public double? DiscontinuousConductionShare { get; init; }

    /// <summary>Scores by key (see <see cref="ScoreCatalog"/>); empty if failed.</summary>
    public required SortedDictionary<string, double?> Scores { get; init; }

    /// <summary>Settling after each event.</summary>
    public required IReadOnlyList<SettlingEntry> Settling { get; init; }

    /// <summary>Per-window energies and efficiencies.</summary>
    public required IReadOnlyList<WindowEntry> Windows { get; init; }
}

/// <summary>Settling after one event.</summary>
/// <param name="EventS">Event time [s].</param>
/// <param name="Label">What happened.</param>
/// <param name="SettlingTimeS">Settling time [s], null if never settled.</param>
public sealed record SettlingEntry(double EventS, string Label, double? SettlingTimeS);

/// <summary>One scored window.</summary>
/// <param name="Name">Window name.</param>
/// <param name="StartS">Start [s].</param>
/// <param name="EndS">End [s].</param>
/// <param name="SlopeWm2PerS">Ramp slope [W/m2/s] or null.</param>
/// <param name="EnergyWh">Energy taken [Wh].</param>
/// <param name="AvailableWh">Energy available [Wh].</param>
/// <param name="Efficiency">Ratio [-]; null when nothing was available.</param>
public sealed record WindowEntry(string Name, double StartS, double EndS,
    [property: System.Text.Json.Serialization.JsonPropertyName("slope_w_m2_per_s")] double? SlopeWm2PerS, double EnergyWh, double AvailableWh, double? Efficiency);

/// <summary>One tracker call before a failure.</summary>
/// <param name="TimeS">Sample instant [s].</param>
/// <param name="VoltageV">Sensed voltage [V].</param>
/// <param name="CurrentA">Sensed current [A].</param>
/// <param name="Command">Command returned [V or -]; null where the call returned none.</param>
public sealed record RecentCall(double TimeS, double VoltageV, double CurrentA, double? Command);
