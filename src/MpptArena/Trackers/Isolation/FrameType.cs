namespace MpptArena.Trackers.Isolation;

/// <summary>The frame types of the tracker host protocol (docs/tracker-host-protocol.md, version 1).</summary>
public enum FrameType : byte
{
    /// <summary>Host to arena, first frame: protocol version, capabilities, command kind, declared parameters.</summary>
    Hello = 0x01,

    /// <summary>Arena to host: make a fresh tracker instance from a context and parameter values.</summary>
    Create = 0x02,

    /// <summary>Host to arena: the instance exists; its command for t = 0.</summary>
    Created = 0x03,

    /// <summary>Arena to host: one measurement, with a sequence number.</summary>
    Step = 0x04,

    /// <summary>Host to arena: the command answering the step of the same sequence number.</summary>
    Command = 0x05,

    /// <summary>Arena to host: drop the instance.</summary>
    Destroy = 0x06,

    /// <summary>Host to arena: the instance is gone.</summary>
    Destroyed = 0x07,

    /// <summary>Host to arena: the last request failed (kind, message, details such as a stack trace).</summary>
    Error = 0x08,

    /// <summary>Arena to host (optional extension): exchange steps through the shared slot in this file.</summary>
    Map = 0x09,

    /// <summary>Host to arena: the slot is mapped; steps go through it from now on.</summary>
    Mapped = 0x0A,

    /// <summary>Either way: the peer published something in the shared slot while this side slept.</summary>
    Wake = 0x0B,
}
