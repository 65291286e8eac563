namespace MpptArena.Trackers;

/// <summary>Where a tracker kind's code comes from, which decides how far the arena trusts it.</summary>
public enum TrackerOrigin
{
    /// <summary>Shipped with the arena; runs in process.</summary>
    BuiltIn,

    /// <summary>A user's .NET plug-in assembly.</summary>
    Plugin,

    /// <summary>A user's C library through mppt_arena_tracker.h.</summary>
    Native,

    /// <summary>A user's executable that speaks the tracker host protocol.</summary>
    Command,
}
