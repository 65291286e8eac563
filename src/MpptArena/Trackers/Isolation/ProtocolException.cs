namespace MpptArena.Trackers.Isolation;

/// <summary>A peer broke the tracker host protocol: a malformed, truncated or unexpected frame.</summary>
public sealed class ProtocolException(string message) : Exception(message);
