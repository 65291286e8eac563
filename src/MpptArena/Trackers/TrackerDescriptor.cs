namespace MpptArena.Trackers;

/// <summary>A kind of tracker the arena can build: its name, what it is, where it is published, its parameters and its factory.</summary>
/// <param name="Kind">Name used in scenario files (snake_case).</param>
/// <param name="Summary">One line for listings.</param>
/// <param name="Source">Published source of the method.</param>
/// <param name="Parameters">Declared parameters.</param>
/// <param name="Create">Builds a fresh instance from checked settings.</param>
public sealed record TrackerDescriptor(
    string Kind,
    string Summary,
    string Source,
    IReadOnlyList<TrackerParameter> Parameters,
    Func<TrackerSettings, IMpptTracker> Create);
