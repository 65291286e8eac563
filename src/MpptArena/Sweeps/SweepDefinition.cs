using MpptArena.Scenarios;

namespace MpptArena.Sweeps;

/// <summary>A validated sweep: a scenario suite, trackers with their axes, sampling, objective and plots.</summary>
/// <param name="Name">Sweep name.</param>
/// <param name="Scenarios">The suite.</param>
/// <param name="Trackers">Trackers and their axes.</param>
/// <param name="Sampling">How the axes are covered.</param>
/// <param name="ObjectiveScore">Score key that "best" means.</param>
/// <param name="HeatmapX">Axis name on the heat map's x, or null for the first swept axis.</param>
/// <param name="HeatmapY">Axis name on the heat map's y, or null for the second.</param>
/// <param name="Tune">Automatic tuning, if asked for.</param>
public sealed record SweepDefinition(
    string Name,
    IReadOnlyList<Scenario> Scenarios,
    IReadOnlyList<SweepTracker> Trackers,
    SweepSampling Sampling,
    string ObjectiveScore,
    string? HeatmapX,
    string? HeatmapY,
    TuneSettings? Tune);

/// <summary>Automatic tuning of one tracker's continuous parameters.</summary>
/// <param name="TrackerName">Which tracker of the sweep.</param>
/// <param name="Parameters">Parameters to tune (within their declared ranges).</param>
/// <param name="Score">Score to optimise.</param>
/// <param name="Maximise">True to maximise, false to minimise.</param>
/// <param name="WorstCase">True to optimise the worst scenario, false the mean over scenarios.</param>
/// <param name="MaxEvaluations">Bound on objective evaluations.</param>
public sealed record TuneSettings(string TrackerName, IReadOnlyList<string> Parameters, string Score, bool Maximise, bool WorstCase, int MaxEvaluations);
