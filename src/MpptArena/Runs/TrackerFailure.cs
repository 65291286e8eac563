namespace MpptArena.Runs;

/// <summary>Why and when a tracker was stopped.</summary>
/// <param name="TimeS">Simulation time of the failure [s].</param>
/// <param name="Reason">What it did wrong.</param>
public sealed record TrackerFailure(double TimeS, string Reason);
