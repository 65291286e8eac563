using MpptArena.Trackers;

namespace MpptArena.Sweeps;

/// <summary>A tracker entry of a sweep: its kind, fixed parameters, and the axes it is swept along.</summary>
/// <param name="Name">Tracker name in results.</param>
/// <param name="Descriptor">Tracker kind.</param>
/// <param name="Fixed">Parameter values that do not vary.</param>
/// <param name="Axes">Swept quantities (parameters and optionally "period_ms").</param>
/// <param name="PeriodMs">Sample period when it is not swept [ms].</param>
public sealed record SweepTracker(string Name, TrackerDescriptor Descriptor, IReadOnlyDictionary<string, double> Fixed, IReadOnlyList<SweepAxis> Axes, double PeriodMs)
{
    /// <summary>Budgets of the tracker's calls and host.</summary>
    public Trackers.Isolation.TrackerLimits Limits { get; init; } = Trackers.Isolation.TrackerLimits.Default;
}
