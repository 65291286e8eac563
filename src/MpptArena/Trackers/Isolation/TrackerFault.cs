namespace MpptArena.Trackers.Isolation;

/// <summary>A tracker under test broke the contract or its limits: the reason reads as a firmware developer would want it.</summary>
/// <param name="reason">What happened, e.g. "killed by SIGSEGV during step at t = 12.34 s, call 1234".</param>
/// <param name="details">A stack trace or the tail of the tracker's log, or empty.</param>
public sealed class TrackerFault(string reason, string details = "") : Exception(reason)
{
    /// <summary>What happened.</summary>
    public string Reason { get; } = reason;

    /// <summary>Stack trace or log tail; may be empty.</summary>
    public string Details { get; } = details;
}
