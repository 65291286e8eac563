namespace MpptArena.Scoring;

/// <summary>Every score of one tracker over one run. Efficiencies are energy ratios [-]; energies in Wh.</summary>
public sealed record TrackerScores
{
    /// <summary>Energy taken / energy available at the global MPP, whole run [-].</summary>
    public required double TrackingEfficiency { get; init; }

    /// <summary>The same, only while conditions have been constant for at least the static allowance [-]; null if never.</summary>
    public required double? StaticEfficiency { get; init; }

    /// <summary>Energy taken from the array [Wh].</summary>
    public required double EnergyWh { get; init; }

    /// <summary>Energy available at the global MPP [Wh].</summary>
    public required double AvailableEnergyWh { get; init; }

    /// <summary>Available minus taken [Wh].</summary>
    public double EnergyLostWh => AvailableEnergyWh - EnergyWh;

    /// <summary>Settling time of the start-up event at t = 0 [s]; null if it never settled before the next event.</summary>
    public required double? StartupTimeS { get; init; }

    /// <summary>Mean settling time over events that settled [s].</summary>
    public required double? MeanSettlingTimeS { get; init; }

    /// <summary>Longest settling time over events that settled [s].</summary>
    public required double? WorstSettlingTimeS { get; init; }

    /// <summary>Events after which power never settled before the next event.</summary>
    public required int EventsNeverSettled { get; init; }

    /// <summary>Settling per event.</summary>
    public required IReadOnlyList<SettlingScore> Settling { get; init; }

    /// <summary>Peak-to-peak of V - Vmpp while settled [V], duration-weighted mean over settled spans.</summary>
    public required double? RippleVoltagePeakToPeakV { get; init; }

    /// <summary>Peak-to-peak of Pmpp - P while settled [W].</summary>
    public required double? RipplePowerPeakToPeakW { get; init; }

    /// <summary>Mean of Pmpp - P while settled [W]: the power lost to oscillation.</summary>
    public required double? RippleMeanLossW { get; init; }

    /// <summary>Energy lost while settled but outside the settling band, with no event in between [Wh]: scans, open-circuit samples, perturbations larger than the band.</summary>
    public double ExcursionEnergyLostWh { get; init; }

    /// <summary>Time spent on such excursions [s].</summary>
    public double ExcursionTimeS { get; init; }

    /// <summary>Time with more than one peak on the curve [s].</summary>
    public required double MultiPeakTimeS { get; init; }

    /// <summary>Share of the multi-peak time spent on the hill of the global maximum [-]; null if no multi-peak time.</summary>
    public required double? GlobalPeakTimeShare { get; init; }

    /// <summary>Energy lost while sitting on a lower hill [Wh].</summary>
    public required double LowerPeakEnergyLostWh { get; init; }

    /// <summary>Where the lost energy went; the parts add up to <see cref="EnergyLostWh"/>.</summary>
    public required EnergySplit EnergySplit { get; init; }

    /// <summary>Time the command stayed frozen while the MPP moved away.</summary>
    public required StallRecord Stall { get; init; }

    /// <summary>Per-window efficiencies.</summary>
    public required IReadOnlyList<WindowScore> Windows { get; init; }

    /// <summary>Totals over groups of windows (a whole standard ramp sequence).</summary>
    public required IReadOnlyList<WindowScore> Groups { get; init; }
}
