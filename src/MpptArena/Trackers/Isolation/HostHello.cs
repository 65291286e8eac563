namespace MpptArena.Trackers.Isolation;

/// <summary>What a host says about its tracker in its first frame.</summary>
/// <param name="ProtocolVersion">Protocol version the host speaks.</param>
/// <param name="Flags">Capabilities (<see cref="HostProtocol.SharedSlotFlag"/>).</param>
/// <param name="CommandKind">What its commands mean.</param>
/// <param name="Summary">One line about the tracker.</param>
/// <param name="Parameters">Declared parameters.</param>
public sealed record HostHello(uint ProtocolVersion, uint Flags, TrackerCommandKind CommandKind, string Summary, IReadOnlyList<TrackerParameter> Parameters);
