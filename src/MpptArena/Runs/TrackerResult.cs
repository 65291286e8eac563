using MpptArena.Scoring;

namespace MpptArena.Runs;

/// <summary>The outcome of one tracker in one run.</summary>
/// <param name="Name">Tracker name from the scenario.</param>
/// <param name="Kind">Tracker kind.</param>
/// <param name="SamplePeriodS">Sample period [s].</param>
/// <param name="Parameters">Parameter values, sorted by name.</param>
/// <param name="Scores">Scores; null if the tracker failed.</param>
/// <param name="Failure">Failure, or null.</param>
/// <param name="TrackerCalls">Number of tracker calls made.</param>
/// <param name="MeanComputeNs">Mean wall time per tracker call [ns], timed on one call in 16; informational, machine dependent.</param>
/// <param name="DiscontinuousTimeS">Time the converter spent in discontinuous conduction [s] (until a failure stopped it); null for the ideal source.</param>
public sealed record TrackerResult(
    string Name,
    string Kind,
    double SamplePeriodS,
    IReadOnlyList<KeyValuePair<string, double>> Parameters,
    TrackerScores? Scores,
    TrackerFailure? Failure,
    long TrackerCalls,
    double MeanComputeNs,
    double? DiscontinuousTimeS = null)
{
    /// <summary>Where the lost energy went, for a tracker that failed as well (its loss after the failure is a part).</summary>
    public EnergySplit? EnergySplit { get; init; }

    /// <summary>Time the command stayed frozen while the MPP moved away, for a tracker that failed as well (until it failed).</summary>
    public StallRecord? Stall { get; init; }
}
