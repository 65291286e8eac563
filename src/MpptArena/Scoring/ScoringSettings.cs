namespace MpptArena.Scoring;

/// <summary>How runs are scored.</summary>
/// <param name="SettlingBandFraction">Power band around the MPP power that counts as settled [-], e.g. 0.02.</param>
/// <param name="SettlingHoldS">Time power must stay in the band to count as settled [s].</param>
/// <param name="StaticAllowanceS">Time after start-up not counted in the static efficiency [s].</param>
/// <param name="Windows">Extra windows scored on their own.</param>
/// <param name="CurveSnapshotTimesS">Instants at which the P-V curve is kept for plots [s].</param>
/// <param name="StallFraction">A command held while the MPP voltage moves by more than this fraction of it counts as a stall [-].</param>
public sealed record ScoringSettings(
    double SettlingBandFraction = 0.02,
    double SettlingHoldS = 0.5,
    double StaticAllowanceS = 2.0,
    IReadOnlyList<ScoringWindow>? Windows = null,
    IReadOnlyList<double>? CurveSnapshotTimesS = null,
    double StallFraction = 0.05)
{
    /// <summary>Windows, never null.</summary>
    public IReadOnlyList<ScoringWindow> AllWindows => Windows ?? [];

    /// <summary>Snapshot instants, never null.</summary>
    public IReadOnlyList<double> SnapshotTimes => CurveSnapshotTimesS ?? [];
}
