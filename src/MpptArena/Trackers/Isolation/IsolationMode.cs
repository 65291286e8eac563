namespace MpptArena.Trackers.Isolation;

/// <summary>Where a user's tracker runs.</summary>
public enum IsolationMode
{
    /// <summary>In a host process of its own (the default for C libraries, C# plug-ins and commands).</summary>
    Process,

    /// <summary>Inside the arena: fastest, but its globals are shared and a crash, exit or hang takes the arena with it.</summary>
    InProcess,
}
