namespace MpptArena.Trackers;

/// <summary>What a tracker's returned number means to the converter.</summary>
public enum TrackerCommandKind
{
    /// <summary>PV voltage reference [V], turned into a duty cycle by the converter's inner voltage loop.</summary>
    VoltageReference,

    /// <summary>Converter duty cycle [-], applied directly.</summary>
    DutyCycle,
}
