namespace MpptArena.Reports.Comparison;

/// <summary>How one score moved from baseline to current.</summary>
public enum ScoreVerdict
{
    /// <summary>Within tolerance.</summary>
    Unchanged,

    /// <summary>Better beyond tolerance.</summary>
    Improved,

    /// <summary>Worse beyond tolerance.</summary>
    Regressed,

    /// <summary>Present in the baseline, absent or undefined now (a tracker that failed or vanished).</summary>
    Missing,

    /// <summary>Absent from the baseline.</summary>
    New,

    /// <summary>A tracker that failed in the baseline and fails in the current run too: still a failure.</summary>
    Failing,
}
