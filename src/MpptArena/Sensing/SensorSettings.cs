namespace MpptArena.Sensing;

/// <summary>What the current channel measures.</summary>
public enum CurrentSignal
{
    /// <summary>The array's current (a shunt or Hall sensor in the PV lead).</summary>
    PvCurrent,

    /// <summary>The inductor's current (the sensor the converter's current loop already has).</summary>
    InductorCurrent,
}

/// <summary>
/// How the ADC conversions see the switching ripple: each conversion samples the instantaneous waveform
/// within its switching period at a phase (0 = the switch turns on), either the same phase every time
/// (conversions triggered by the PWM carrier, as firmware usually does) or a phase drawn uniformly for
/// each conversion (a free-running ADC whose clock is not tied to the carrier).
/// </summary>
/// <param name="CarrierTriggered">True when conversions are triggered by the carrier at <paramref name="PhaseFraction"/>.</param>
/// <param name="PhaseFraction">Phase of carrier-triggered conversions within the period [0, 1).</param>
public sealed record RippleSettings(bool CarrierTriggered, double PhaseFraction);

/// <summary>The two ADC channels a tracker reads.</summary>
/// <param name="Voltage">PV voltage channel [V].</param>
/// <param name="Current">Current channel [A].</param>
/// <param name="CurrentMeasures">What the current channel measures.</param>
/// <param name="Ripple">How conversions see the switching ripple; null for period means (no ripple).</param>
public sealed record SensorSettings(AdcChannelSettings Voltage, AdcChannelSettings Current,
    CurrentSignal CurrentMeasures = CurrentSignal.PvCurrent, RippleSettings? Ripple = null);
