namespace MpptArena.Reports.Output;

/// <summary>What an output folder the user named holds, once it has been found safe to write.</summary>
public enum OutputTargetState
{
    /// <summary>Nothing is there yet.</summary>
    Absent,

    /// <summary>An empty folder.</summary>
    Empty,

    /// <summary>A folder the arena wrote, holding only its own files; replaced only with --force.</summary>
    ArenaOutput,
}
