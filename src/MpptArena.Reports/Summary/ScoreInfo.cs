namespace MpptArena.Reports.Summary;

/// <summary>What one score key in summary.json means.</summary>
/// <param name="Key">Key in the summary's scores object.</param>
/// <param name="Unit">Unit.</param>
/// <param name="Direction">Which way is better.</param>
/// <param name="Description">One line for reports.</param>
/// <param name="DefaultAbsoluteTolerance">Default regression tolerance, absolute, in the score's unit.</param>
/// <param name="DefaultRelativeTolerance">Default regression tolerance, relative to the baseline [-].</param>
public sealed record ScoreInfo(string Key, string Unit, ScoreDirection Direction, string Description,
    double DefaultAbsoluteTolerance, double DefaultRelativeTolerance);
