namespace MpptArena.Runs;

/// <summary>The immutable outcome of running one scenario: what exporters and plots read.</summary>
/// <param name="ScenarioName">Scenario name.</param>
/// <param name="Description">Scenario description.</param>
/// <param name="Seed">Random seed used.</param>
/// <param name="PlantDigest">Digest of the plant description (module, layout, converter, sensors).</param>
/// <param name="DurationS">Simulated time [s].</param>
/// <param name="PlantStepS">Plant step [s].</param>
/// <param name="Trackers">One result per tracker, in scenario order.</param>
/// <param name="Snapshots">P-V curves kept for plots.</param>
/// <param name="CurvePreparations">Times the array curve was prepared.</param>
/// <param name="WallTimeS">Wall time of the run [s]; informational, machine dependent.</param>
public sealed record RunResult(
    string ScenarioName,
    string Description,
    ulong Seed,
    string PlantDigest,
    double DurationS,
    double PlantStepS,
    IReadOnlyList<TrackerResult> Trackers,
    IReadOnlyList<CurveSnapshot> Snapshots,
    int CurvePreparations,
    double WallTimeS);
