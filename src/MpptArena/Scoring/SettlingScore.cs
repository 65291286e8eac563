namespace MpptArena.Scoring;

/// <summary>Settling after one event.</summary>
/// <param name="EventS">Time of the event [s].</param>
/// <param name="Label">What happened (start-up, irradiance change, shading change).</param>
/// <param name="SettlingTimeS">Time from the event until power entered, and then stayed for the hold time in, the band around the MPP power [s]; null when it never settled before the next event or the end.</param>
public sealed record SettlingScore(double EventS, string Label, double? SettlingTimeS);
