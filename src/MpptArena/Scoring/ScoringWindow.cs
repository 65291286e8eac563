namespace MpptArena.Scoring;

/// <summary>A span of the run scored on its own (a ramp block of a standard sequence, a user's window).</summary>
/// <param name="Name">Name in reports.</param>
/// <param name="StartS">Start [s].</param>
/// <param name="EndS">End [s].</param>
/// <param name="SlopeWm2PerS">Irradiance slope of a ramp block [W/m2/s], if it is one.</param>
/// <param name="Group">Windows of one group (one standard sequence) are also reported as a total.</param>
public sealed record ScoringWindow(string Name, double StartS, double EndS, double? SlopeWm2PerS = null, string? Group = null);
