using System.Buffers.Binary;
using System.Text;

namespace MpptArena.Trackers.Isolation;

/// <summary>Reads frames from a stream into a reusable buffer and decodes their fields in order.</summary>
public sealed class FrameReader(Stream stream)
{
    private byte[] _buffer = new byte[256];
    private int _length, _position;

    /// <summary>Type of the frame last read.</summary>
    public FrameType Type { get; private set; }

    /// <summary>Reads the next frame; false at a clean end of stream before any byte of it.</summary>
    /// <exception cref="ProtocolException">The stream ended inside a frame, or the length is out of range.</exception>
    public bool Next()
    {
        Span<byte> header = stackalloc byte[4];
        int got = ReadAtMost(header);
        if (got == 0) return false;
        if (got < 4) throw new ProtocolException("the stream ended inside a frame header");
        uint length = BinaryPrimitives.ReadUInt32LittleEndian(header);
        if (length < 1 || length > HostProtocol.MaxFrameBytes)
        {
            throw new ProtocolException($"a frame of {length} bytes (expected 1 to {HostProtocol.MaxFrameBytes}); is something else writing to the protocol stream?");
        }
        if (_buffer.Length < length) _buffer = new byte[Math.Max(length, 2 * _buffer.Length)];
        if (ReadAtMost(_buffer.AsSpan(0, (int)length)) < length) throw new ProtocolException("the stream ended inside a frame");
        _length = (int)length;
        _position = 1;
        Type = (FrameType)_buffer[0];
        return true;
    }

    /// <summary>Reads frames until one that is not <see cref="FrameType.Wake"/>; false at the end of stream.</summary>
    public bool NextSkippingWakes()
    {
        while (Next())
        {
            if (Type != FrameType.Wake) return true;
        }
        return false;
    }

    /// <summary>Next byte of the payload.</summary>
    public byte U8()
    {
        Need(1);
        return _buffer[_position++];
    }

    /// <summary>Next unsigned 32-bit integer.</summary>
    public uint U32()
    {
        Need(4);
        uint v = BinaryPrimitives.ReadUInt32LittleEndian(_buffer.AsSpan(_position));
        _position += 4;
        return v;
    }

    /// <summary>Next signed 32-bit integer.</summary>
    public int I32() => unchecked((int)U32());

    /// <summary>Next signed 64-bit integer.</summary>
    public long I64()
    {
        Need(8);
        long v = BinaryPrimitives.ReadInt64LittleEndian(_buffer.AsSpan(_position));
        _position += 8;
        return v;
    }

    /// <summary>Next double.</summary>
    public double F64() => BitConverter.Int64BitsToDouble(I64());

    /// <summary>Next string.</summary>
    public string Text()
    {
        int n = (int)U32();
        if (n < 0 || n > _length - _position) throw new ProtocolException($"a string of {n} bytes overruns its {Type} frame");
        string s = Encoding.UTF8.GetString(_buffer, _position, n);
        _position += n;
        return s;
    }

    private void Need(int n)
    {
        if (_position + n > _length) throw new ProtocolException($"the {Type} frame is shorter than its fields ({_length} bytes)");
    }

    private int ReadAtMost(Span<byte> target)
    {
        int total = 0;
        while (total < target.Length)
        {
            int n = stream.Read(target[total..]);
            if (n <= 0) break;
            total += n;
        }
        return total;
    }
}
