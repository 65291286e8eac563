namespace MpptArena.Trackers;

/// <summary>A tuning parameter a tracker declares, so that scenario checks, sweeps and reports know it.</summary>
/// <param name="Name">Key in scenario and sweep files (snake_case, unit suffix).</param>
/// <param name="Unit">Unit, e.g. "V", "s", "-".</param>
/// <param name="Default">Value when the scenario does not set it.</param>
/// <param name="Min">Lowest accepted value.</param>
/// <param name="Max">Highest accepted value.</param>
/// <param name="Description">One line for the documentation.</param>
public sealed record TrackerParameter(string Name, string Unit, double Default, double Min, double Max, string Description);
