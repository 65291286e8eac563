namespace MpptArena.Reports.Sweeps;

/// <summary>The stored outcome of one sweep case (cases/&lt;id&gt;.json). Deterministic: no timings.</summary>
public sealed record SweepCaseResult
{
    /// <summary>Case identifier (16 hex digits).</summary>
    public required string CaseId { get; init; }

    /// <summary>Scenario name.</summary>
    public required string Scenario { get; init; }

    /// <summary>Seed of the case when its scenario runs over several seeds; absent otherwise.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public ulong? Seed { get; init; }

    /// <summary>Tracker name.</summary>
    public required string Tracker { get; init; }

    /// <summary>Tracker kind.</summary>
    public required string Kind { get; init; }

    /// <summary>Sample period [ms].</summary>
    public required double PeriodMs { get; init; }

    /// <summary>Parameter values by name.</summary>
    public required SortedDictionary<string, double> Parameters { get; init; }

    /// <summary>True if the tracker failed.</summary>
    public required bool Failed { get; init; }

    /// <summary>Failure reason, if failed.</summary>
    public string? FailureReason { get; init; }

    /// <summary>Scores by key (see the score catalogue); empty if failed.</summary>
    public required SortedDictionary<string, double?> Scores { get; init; }
}
