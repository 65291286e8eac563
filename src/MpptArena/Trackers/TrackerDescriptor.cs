using MpptArena.Trackers.Isolation;

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
    Func<TrackerSettings, IMpptTracker> Create)
{
    /// <summary>Where the code comes from.</summary>
    public TrackerOrigin Origin { get; init; } = TrackerOrigin.BuiltIn;

    /// <summary>The plug-in assembly or C library the kind comes from, or null.</summary>
    public string? OriginPath { get; init; }

    /// <summary>Where its instances run.</summary>
    public IsolationMode Isolation { get; init; } = IsolationMode.InProcess;

    /// <summary>
    /// Digest of the tracker's code outside the arena (a C library's or plug-in's bytes, a command and the files
    /// it names), or null for a built-in, whose code is the tool version's.
    /// </summary>
    public string? CodeDigest { get; init; }

    /// <summary>What the kind's instances command, when known without creating one (an isolated tracker says so when its host starts).</summary>
    public TrackerCommandKind? DeclaredCommandKind { get; init; }

    /// <summary>True for a user's code that runs inside the arena: its calls are watched, since they cannot be stopped.</summary>
    public bool IsUserCodeInProcess => Origin != TrackerOrigin.BuiltIn && Isolation == IsolationMode.InProcess;
}
