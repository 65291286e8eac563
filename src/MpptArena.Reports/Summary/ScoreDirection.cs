namespace MpptArena.Reports.Summary;

/// <summary>Which way a score gets better.</summary>
public enum ScoreDirection
{
    /// <summary>Larger is better (efficiencies, energy taken).</summary>
    HigherIsBetter,

    /// <summary>Smaller is better (times, losses, ripple).</summary>
    LowerIsBetter,

    /// <summary>Describes the scenario, not the tracker (available energy); never a regression.</summary>
    Neutral,
}
