namespace MpptArena.Reports.Summary;

/// <summary>
/// The contents of summary.json, schema <see cref="SchemaId"/> (docs/summary.schema.json). Key names are
/// stable: CI scripts read them. Everything in it is deterministic for a scenario and seed; machine-
/// dependent timings go to timing.json instead.
/// </summary>
public sealed record RunSummary
{
    /// <summary>Schema identifier written into every summary.</summary>
    public const string SchemaId = "mppt-arena/summary/2";

    /// <summary>The earlier schema, still read (by <c>compare</c>): it has no seed statistics and no energy split.</summary>
    public const string PreviousSchemaId = "mppt-arena/summary/1";

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

    /// <summary>
    /// Over several seeds: the pairs of trackers whose tracking efficiencies the seeds cannot tell apart (the
    /// confidence interval of their seed-by-seed difference holds zero); null for one seed.
    /// </summary>
    public IReadOnlyList<TrackerPair>? Indistinguishable { get; init; }
}

/// <summary>Two trackers compared seed by seed on tracking efficiency.</summary>
/// <param name="First">The tracker ranked higher.</param>
/// <param name="Second">The tracker ranked lower.</param>
/// <param name="MeanDifference">Mean over seeds of First's efficiency minus Second's [-].</param>
/// <param name="ConfidenceLow">Lower end of its 95 % confidence interval [-].</param>
/// <param name="ConfidenceHigh">Upper end [-].</param>
public sealed record TrackerPair(string First, string Second, double MeanDifference, double? ConfidenceLow, double? ConfidenceHigh);

/// <summary>Scenario identification in a summary.</summary>
public sealed record ScenarioInfo
{
    /// <summary>Scenario name.</summary>
    public required string Name { get; init; }

    /// <summary>Scenario description.</summary>
    public required string Description { get; init; }

    /// <summary>Seed (the first of <see cref="Seeds"/>).</summary>
    public required ulong Seed { get; init; }

    /// <summary>Every seed the scores are taken over, in run order; null in summaries of schema 1 (one seed, <see cref="Seed"/>).</summary>
    public IReadOnlyList<ulong>? Seeds { get; init; }

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

    /// <summary>Scores by key (see <see cref="ScoreCatalog"/>); empty if failed. Over several seeds, the mean over seeds
    /// (null where a score is undefined for any seed).</summary>
    public required SortedDictionary<string, double?> Scores { get; init; }

    /// <summary>The seed a failure happened with, over several seeds; null otherwise.</summary>
    public ulong? FailureSeed { get; init; }

    /// <summary>Over several seeds: mean, spread and confidence interval of every score over the seeds where it is defined; null for one seed.</summary>
    public SortedDictionary<string, ScoreStatistics>? Statistics { get; init; }

    /// <summary>Over several seeds: every score per seed, in seed order (what <c>compare</c> pairs); null for one seed.</summary>
    public IReadOnlyList<SeedScores>? PerSeed { get; init; }

    /// <summary>Where the lost energy went (also for a tracker that failed); null in summaries of schema 1.</summary>
    public EnergySplitEntry? EnergySplit { get; init; }

    /// <summary>Whether and how long the command stayed frozen while the MPP moved away; null in summaries of schema 1.</summary>
    public StallEntry? Stall { get; init; }

    /// <summary>Settling after each event (over several seeds, of the first seed).</summary>
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

/// <summary>One score over the seeds of a run.</summary>
/// <param name="Seeds">Seeds where the score is defined.</param>
/// <param name="Undefined">Seeds where it is not (e.g. never settled).</param>
/// <param name="Mean">Mean over the seeds where it is defined.</param>
/// <param name="StandardDeviation">Sample standard deviation; null with fewer than two.</param>
/// <param name="Min">Smallest value.</param>
/// <param name="Max">Largest value.</param>
/// <param name="ConfidenceLow">Lower end of the 95 % Student t confidence interval of the mean; null with fewer than two.</param>
/// <param name="ConfidenceHigh">Upper end; null with fewer than two.</param>
public sealed record ScoreStatistics(int Seeds, int Undefined, double Mean, double? StandardDeviation, double Min, double Max, double? ConfidenceLow, double? ConfidenceHigh);

/// <summary>The scores of one seed.</summary>
/// <param name="Seed">Seed.</param>
/// <param name="Scores">Scores by key, as for one seed.</param>
public sealed record SeedScores(ulong Seed, SortedDictionary<string, double?> Scores);

/// <summary>The energy split of summary.json: parts that add up to the energy lost [Wh] (over several seeds, means).</summary>
/// <param name="StartupWh">From t = 0 until the start-up event settled.</param>
/// <param name="AfterEventsWh">After later events until settled.</param>
/// <param name="SteadyStateWh">Settled, inside the band.</param>
/// <param name="LowerHillWh">On a lower hill of a multi-peak curve.</param>
/// <param name="ExcursionsWh">Settled, outside the band.</param>
/// <param name="AfterFailureWh">After the tracker failed.</param>
/// <param name="TotalWh">The sum of the parts.</param>
public sealed record EnergySplitEntry(double StartupWh, double AfterEventsWh, double SteadyStateWh, double LowerHillWh, double ExcursionsWh, double AfterFailureWh, double TotalWh)
{
    /// <summary>The entry of a split.</summary>
    public static EnergySplitEntry Of(MpptArena.Scoring.EnergySplit s) =>
        new(s.StartupWh, s.AfterEventsWh, s.SteadyStateWh, s.LowerHillWh, s.ExcursionsWh, s.AfterFailureWh, s.TotalWh);

    /// <summary>The parts with their labels, in report order (without the total).</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public IReadOnlyList<(string Label, double Wh)> Parts =>
        [("start-up", StartupWh), ("after events", AfterEventsWh), ("steady state", SteadyStateWh), ("lower hill", LowerHillWh), ("excursions", ExcursionsWh), ("after failure", AfterFailureWh)];
}

/// <summary>The stall record of summary.json.</summary>
/// <param name="Stalled">True when the command stayed frozen while the MPP voltage moved by more than the stall fraction (over several seeds: in any seed).</param>
/// <param name="StallTimeS">Time stalled [s] (over seeds, the mean).</param>
/// <param name="FirstStallS">When the first stall began [s] (over seeds, the earliest); null if none.</param>
/// <param name="StallEnergyLostWh">Energy lost while stalled [Wh] (over seeds, the mean).</param>
public sealed record StallEntry(bool Stalled, double StallTimeS, double? FirstStallS, double StallEnergyLostWh);
