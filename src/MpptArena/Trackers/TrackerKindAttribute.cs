namespace MpptArena.Trackers;

/// <summary>
/// Marks a class in a plug-in assembly as a tracker kind. The class implements <see cref="IMpptTracker"/>,
/// has a public constructor taking <see cref="TrackerSettings"/>, and may declare its parameters in a
/// public static property <c>Parameters</c> of type <c>IReadOnlyList&lt;TrackerParameter&gt;</c>.
/// </summary>
/// <param name="kind">Name used in scenario files (snake_case).</param>
[AttributeUsage(AttributeTargets.Class, AllowMultiple = false, Inherited = false)]
public sealed class TrackerKindAttribute(string kind) : Attribute
{
    /// <summary>Name used in scenario files.</summary>
    public string Kind { get; } = kind;

    /// <summary>One line for listings.</summary>
    public string Summary { get; init; } = "";

    /// <summary>Published source of the method, if any.</summary>
    public string Source { get; init; } = "";
}
