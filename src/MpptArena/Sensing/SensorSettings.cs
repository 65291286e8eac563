namespace MpptArena.Sensing;

/// <summary>The two ADC channels a tracker reads.</summary>
/// <param name="Voltage">PV voltage channel [V].</param>
/// <param name="Current">PV current channel [A].</param>
public sealed record SensorSettings(AdcChannelSettings Voltage, AdcChannelSettings Current);
