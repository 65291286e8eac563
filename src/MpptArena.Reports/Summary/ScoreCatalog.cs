using MpptArena.Scoring;

namespace MpptArena.Reports.Summary;

/// <summary>The score keys of summary.json, their meaning, and how they are read off <see cref="TrackerScores"/>.</summary>
public static class ScoreCatalog
{
    /// <summary>Prefix of per-window efficiency keys.</summary>
    public const string WindowPrefix = "window:";

    /// <summary>Every fixed score key in report order.</summary>
    public static IReadOnlyList<ScoreInfo> All { get; } =
    [
        new("tracking_efficiency", "-", ScoreDirection.HigherIsBetter, "Energy taken / energy at the global MPP, whole run (EN 50530, IEC 62891)", 0.001, 0),
        new("static_efficiency", "-", ScoreDirection.HigherIsBetter, "The same while conditions were constant, after the settling allowance", 0.001, 0),
        new("energy_wh", "Wh", ScoreDirection.HigherIsBetter, "Energy taken from the array", 0, 0.001),
        new("available_energy_wh", "Wh", ScoreDirection.Neutral, "Energy available at the global MPP", 0, 0),
        new("energy_lost_wh", "Wh", ScoreDirection.LowerIsBetter, "Available minus taken", 1e-4, 0.02),
        new("startup_time_s", "s", ScoreDirection.LowerIsBetter, "Settling time of the start-up event at t = 0", 0.02, 0.05),
        new("mean_settling_time_s", "s", ScoreDirection.LowerIsBetter, "Mean settling time over events that settled", 0.02, 0.05),
        new("worst_settling_time_s", "s", ScoreDirection.LowerIsBetter, "Longest settling time over events that settled", 0.02, 0.05),
        new("events_never_settled", "-", ScoreDirection.LowerIsBetter, "Events after which power did not settle before the next event", 0, 0),
        new("ripple_voltage_pp_v", "V", ScoreDirection.LowerIsBetter, "Peak-to-peak of V - Vmpp while settled", 0.1, 0.05),
        new("ripple_power_pp_w", "W", ScoreDirection.LowerIsBetter, "Peak-to-peak of Pmpp - P while settled", 0.5, 0.05),
        new("ripple_mean_loss_w", "W", ScoreDirection.LowerIsBetter, "Mean power lost to oscillation while settled (inside the settling band)", 0.1, 0.05),
        new("excursion_energy_lost_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy lost on excursions out of the band while settled: scans, open-circuit samples, large perturbations", 1e-4, 0.02),
        new("excursion_time_s", "s", ScoreDirection.Neutral, "Time spent on such excursions", 0, 0),
        new("multi_peak_time_s", "s", ScoreDirection.Neutral, "Time the P-V curve had more than one maximum", 0, 0),
        new("global_peak_time_share", "-", ScoreDirection.HigherIsBetter, "Share of multi-peak time spent on the global maximum's hill", 0.005, 0),
        new("lower_peak_energy_lost_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy lost while on a lower hill", 1e-4, 0.02),
        new("lost_startup_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: lost from t = 0 until the start-up event settled", 1e-4, 0.02),
        new("lost_after_events_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: lost after irradiance, temperature and shading events until settled", 1e-4, 0.02),
        new("lost_steady_state_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: lost while settled inside the band (oscillation around the MPP)", 1e-4, 0.02),
        new("lost_lower_hill_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: lost while on a lower hill of a multi-peak curve", 1e-4, 0.02),
        new("lost_excursions_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: lost while settled but outside the band (scans, open-circuit samples)", 1e-4, 0.02),
        new("lost_after_failure_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy split: available after the tracker failed (0 for a tracker that ran to the end)", 1e-4, 0.02),
        new("stall_time_s", "s", ScoreDirection.LowerIsBetter, "Time the command stayed frozen while the MPP voltage moved by more than the stall fraction", 0.05, 0.05),
        new("stall_energy_lost_wh", "Wh", ScoreDirection.LowerIsBetter, "Energy lost while stalled", 1e-4, 0.02),
    ];

    /// <summary>Information for a key, including window keys; null if unknown.</summary>
    public static ScoreInfo? Find(string key)
    {
        if (key.StartsWith(WindowPrefix, StringComparison.Ordinal))
        {
            return new ScoreInfo(key, "-", ScoreDirection.HigherIsBetter, "Tracking efficiency over a window", 0.001, 0);
        }
        return All.FirstOrDefault(s => s.Key == key);
    }

    /// <summary>The scores of one tracker as key to value (null where undefined, e.g. never settled).</summary>
    public static SortedDictionary<string, double?> ToDictionary(TrackerScores s)
    {
        var d = new SortedDictionary<string, double?>(StringComparer.Ordinal)
        {
            ["tracking_efficiency"] = s.TrackingEfficiency,
            ["static_efficiency"] = s.StaticEfficiency,
            ["energy_wh"] = s.EnergyWh,
            ["available_energy_wh"] = s.AvailableEnergyWh,
            ["energy_lost_wh"] = s.EnergyLostWh,
            ["startup_time_s"] = s.StartupTimeS,
            ["mean_settling_time_s"] = s.MeanSettlingTimeS,
            ["worst_settling_time_s"] = s.WorstSettlingTimeS,
            ["events_never_settled"] = s.EventsNeverSettled,
            ["ripple_voltage_pp_v"] = s.RippleVoltagePeakToPeakV,
            ["ripple_power_pp_w"] = s.RipplePowerPeakToPeakW,
            ["ripple_mean_loss_w"] = s.RippleMeanLossW,
            ["excursion_energy_lost_wh"] = s.ExcursionEnergyLostWh,
            ["excursion_time_s"] = s.ExcursionTimeS,
            ["multi_peak_time_s"] = s.MultiPeakTimeS,
            ["global_peak_time_share"] = s.GlobalPeakTimeShare,
            ["lower_peak_energy_lost_wh"] = s.LowerPeakEnergyLostWh,
            ["lost_startup_wh"] = s.EnergySplit.StartupWh,
            ["lost_after_events_wh"] = s.EnergySplit.AfterEventsWh,
            ["lost_steady_state_wh"] = s.EnergySplit.SteadyStateWh,
            ["lost_lower_hill_wh"] = s.EnergySplit.LowerHillWh,
            ["lost_excursions_wh"] = s.EnergySplit.ExcursionsWh,
            ["lost_after_failure_wh"] = s.EnergySplit.AfterFailureWh,
            ["stall_time_s"] = s.Stall.StallTimeS,
            ["stall_energy_lost_wh"] = s.Stall.StallEnergyLostWh,
        };
        foreach (var w in s.Windows.Concat(s.Groups)) d[WindowPrefix + w.Name] = w.Efficiency;
        return d;
    }
}
