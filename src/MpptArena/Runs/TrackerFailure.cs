namespace MpptArena.Runs;

/// <summary>Why and when a tracker was stopped, with what it saw and did just before.</summary>
/// <param name="TimeS">Simulation time of the failure [s].</param>
/// <param name="Reason">What it did wrong, e.g. "killed by SIGSEGV during step at t = 12.34 s, call 1234".</param>
public sealed record TrackerFailure(double TimeS, string Reason)
{
    /// <summary>A stack trace or the last lines the tracker wrote, or empty (kept in the log, shown on request).</summary>
    public string Details { get; init; } = "";

    /// <summary>The last calls before the failure, oldest first.</summary>
    public IReadOnlyList<TrackerExchange> Recent { get; init; } = [];
}
