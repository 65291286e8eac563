using MpptArena.Trackers;

namespace MpptArena.Host;

/// <summary>Where the host's tracker instances come from; each instance starts with fresh globals.</summary>
internal interface IHostedSource
{
    /// <summary>What HELLO announces.</summary>
    (TrackerCommandKind Kind, string Summary, IReadOnlyList<TrackerParameter> Parameters) Describe();

    /// <summary>A fresh instance and what releases it (with its private copy of the code).</summary>
    (IMpptTracker Tracker, Action Release) Create(TrackerSettings settings);
}
