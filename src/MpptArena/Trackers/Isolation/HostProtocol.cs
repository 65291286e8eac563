namespace MpptArena.Trackers.Isolation;

/// <summary>Constants of the tracker host protocol (docs/tracker-host-protocol.md).</summary>
public static class HostProtocol
{
    /// <summary>The protocol version this arena speaks.</summary>
    public const uint Version = 1;

    /// <summary>HELLO flag: the host can exchange steps through a shared-memory slot (MAP).</summary>
    public const uint SharedSlotFlag = 1;

    /// <summary>Largest frame either side accepts [bytes]; anything longer is a broken peer.</summary>
    public const int MaxFrameBytes = 1 << 20;

    /// <summary>Size of the STEP payload after its sequence number [bytes].</summary>
    public const int MeasurementBytes = 56;

    /// <summary>Size of the CREATE context block [bytes].</summary>
    public const int ContextBytes = 7 * 8 + 2 * 4;
}
