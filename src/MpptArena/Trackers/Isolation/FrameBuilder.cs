using System.Buffers.Binary;
using System.Text;

namespace MpptArena.Trackers.Isolation;

/// <summary>Builds one frame (little-endian, length-prefixed) in a reusable buffer.</summary>
public sealed class FrameBuilder
{
    private byte[] _buffer = new byte[256];
    private int _length;

    /// <summary>Starts a frame of <paramref name="type"/>, discarding what was built before.</summary>
    public FrameBuilder Begin(FrameType type)
    {
        _length = 4;
        _buffer[_length++] = (byte)type;
        return this;
    }

    /// <summary>Appends a byte.</summary>
    public FrameBuilder U8(byte value)
    {
        Ensure(1);
        _buffer[_length++] = value;
        return this;
    }

    /// <summary>Appends an unsigned 32-bit integer.</summary>
    public FrameBuilder U32(uint value)
    {
        Ensure(4);
        BinaryPrimitives.WriteUInt32LittleEndian(_buffer.AsSpan(_length), value);
        _length += 4;
        return this;
    }

    /// <summary>Appends a signed 32-bit integer.</summary>
    public FrameBuilder I32(int value) => U32(unchecked((uint)value));

    /// <summary>Appends a signed 64-bit integer.</summary>
    public FrameBuilder I64(long value)
    {
        Ensure(8);
        BinaryPrimitives.WriteInt64LittleEndian(_buffer.AsSpan(_length), value);
        _length += 8;
        return this;
    }

    /// <summary>Appends an IEEE double, bit for bit.</summary>
    public FrameBuilder F64(double value) => I64(BitConverter.DoubleToInt64Bits(value));

    /// <summary>Appends a string: its UTF-8 byte count, then the bytes.</summary>
    public FrameBuilder Text(string value)
    {
        int n = Encoding.UTF8.GetByteCount(value);
        U32((uint)n);
        Ensure(n);
        _length += Encoding.UTF8.GetBytes(value, _buffer.AsSpan(_length));
        return this;
    }

    /// <summary>The finished frame, its length prefix filled in.</summary>
    public ReadOnlySpan<byte> Finish()
    {
        BinaryPrimitives.WriteUInt32LittleEndian(_buffer, (uint)(_length - 4));
        return _buffer.AsSpan(0, _length);
    }

    /// <summary>Finishes the frame and writes it to <paramref name="stream"/>, flushed.</summary>
    public void SendTo(Stream stream)
    {
        stream.Write(Finish());
        stream.Flush();
    }

    private void Ensure(int more)
    {
        if (_length + more > _buffer.Length) Array.Resize(ref _buffer, Math.Max(_buffer.Length * 2, _length + more));
    }
}
