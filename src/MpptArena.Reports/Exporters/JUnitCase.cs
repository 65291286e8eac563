namespace MpptArena.Reports.Exporters;

/// <summary>One JUnit test case: a tracker x scenario x score check.</summary>
/// <param name="Suite">Suite name (the scenario).</param>
/// <param name="Name">Case name (tracker.score).</param>
/// <param name="Failure">Failure message, or null when it passed.</param>
/// <param name="Output">What was measured.</param>
public sealed record JUnitCase(string Suite, string Name, string? Failure, string Output);
