namespace MpptArena.Trackers;

/// <summary>What a tracker may know about its hardware before it starts, as firmware is configured for its converter.</summary>
/// <param name="SamplePeriodS">The tracker's own sample period [s].</param>
/// <param name="MinCommand">Lowest command the converter accepts [V or -].</param>
/// <param name="MaxCommand">Highest command the converter accepts [V or -].</param>
/// <param name="NominalOpenCircuitVoltageV">Array open-circuit voltage at STC [V], from the datasheet.</param>
/// <param name="NominalShortCircuitCurrentA">Array short-circuit current at STC [A].</param>
/// <param name="VoltageLsbV">Voltage ADC step [V/count].</param>
/// <param name="CurrentLsbA">Current ADC step [A/count].</param>
/// <param name="VoltageBits">Voltage ADC resolution [bits].</param>
/// <param name="CurrentBits">Current ADC resolution [bits].</param>
public sealed record TrackerContext(
    double SamplePeriodS,
    double MinCommand,
    double MaxCommand,
    double NominalOpenCircuitVoltageV,
    double NominalShortCircuitCurrentA,
    double VoltageLsbV,
    double CurrentLsbA,
    int VoltageBits,
    int CurrentBits);
