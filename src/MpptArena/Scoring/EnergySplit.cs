namespace MpptArena.Scoring;

/// <summary>
/// Where a tracker's lost energy (available at the global MPP minus taken) went. Every plant step's loss is
/// booked to exactly one part, so the parts add up to the total. A step is booked, in this order of precedence,
/// to: after failure (the tracker was stopped; nothing is taken); on a lower hill (the curve has several maxima
/// and the operating point is not on the global one's hill); start-up (until the start-up event settled); after
/// events (from an irradiance, temperature or shading event until settled); steady state (settled and inside the
/// settling band: the oscillation around the MPP); excursions (settled but outside the band: scans,
/// open-circuit samples, perturbations larger than the band). All energies in Wh.
/// </summary>
/// <param name="StartupWh">Lost from t = 0 until the start-up event settled [Wh].</param>
/// <param name="AfterEventsWh">Lost after later events until each settled [Wh].</param>
/// <param name="SteadyStateWh">Lost while settled, inside the band [Wh].</param>
/// <param name="LowerHillWh">Lost while on a lower hill of a multi-peak curve [Wh].</param>
/// <param name="ExcursionsWh">Lost while settled but outside the band [Wh].</param>
/// <param name="AfterFailureWh">Available after the tracker failed [Wh].</param>
public sealed record EnergySplit(double StartupWh, double AfterEventsWh, double SteadyStateWh, double LowerHillWh, double ExcursionsWh, double AfterFailureWh)
{
    /// <summary>The parts' sum [Wh]: the energy lost.</summary>
    public double TotalWh => StartupWh + AfterEventsWh + SteadyStateWh + LowerHillWh + ExcursionsWh + AfterFailureWh;

    /// <summary>The parts with their report keys, in report order.</summary>
    public IReadOnlyList<(string Key, string Label, double Wh)> Parts =>
    [
        ("startup", "start-up", StartupWh),
        ("after_events", "after events", AfterEventsWh),
        ("steady_state", "steady state", SteadyStateWh),
        ("lower_hill", "lower hill", LowerHillWh),
        ("excursions", "excursions", ExcursionsWh),
        ("after_failure", "after failure", AfterFailureWh),
    ];
}
