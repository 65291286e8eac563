using MpptArena.Trackers;

namespace MpptArena.Runs;

/// <summary>One tracker entry of a scenario: a named, configured instance of a kind.</summary>
/// <param name="Name">Name shown in reports; unique within a scenario.</param>
/// <param name="Descriptor">The kind.</param>
/// <param name="Settings">Checked parameter values.</param>
/// <param name="SamplePeriodS">Tracker sample period [s].</param>
public sealed record TrackerSpec(string Name, TrackerDescriptor Descriptor, TrackerSettings Settings, double SamplePeriodS)
{
    /// <summary>Budgets the tracker's calls and host must keep.</summary>
    public Trackers.Isolation.TrackerLimits Limits { get; init; } = Trackers.Isolation.TrackerLimits.Default;
}
