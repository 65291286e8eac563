using System.Diagnostics;
using System.IO.MemoryMappedFiles;

namespace MpptArena.Trackers.Isolation;

/// <summary>
/// The optional fast path of the host protocol: one measurement and one command exchanged through a
/// memory-mapped file, each side spinning briefly for the other and then sleeping on the pipe until a
/// WAKE frame arrives. A pipe round trip wakes a sleeping process twice; where waking costs tens of
/// microseconds (virtual machines) the slot answers in under one.
/// </summary>
/// <remarks>
/// Layout (little-endian, 4096 bytes): request sequence (int64) at 0, reply sequence at 64, arena-asleep
/// flag (int32) at 128, host-asleep flag at 192, the STEP payload after its sequence number (56 bytes) at
/// 256, reply status (int32: 0 command, 1 error frame follows on the pipe) at 320, the command (double)
/// at 328, and the arena's core hint (int32) at 384: 1 when more threads wait by spinning than there are
/// cores, so that both sides give their core away between looks; 0 when each has a core of its own and
/// spins without yielding (a yield costs microseconds on a virtual machine). The writer stores the data, then the sequence, then (after a full fence) reads the peer's
/// asleep flag and sends WAKE if it is set; the sleeper sets its flag, fences, and re-reads the sequence
/// before it blocks. One of the two always sees the other (Dekker's argument), so no wake is lost;
/// a stale WAKE only makes the sleeper look once more.
/// </remarks>
public sealed unsafe class SharedStepSlot : IDisposable
{
    /// <summary>File size [bytes].</summary>
    public const int Bytes = 4096;
    private const int RequestOffset = 0, ReplyOffset = 64, ArenaAsleepOffset = 128, HostAsleepOffset = 192, PayloadOffset = 256, StatusOffset = 320, CommandOffset = 328, ShareCoresOffset = 384;

    private readonly MemoryMappedFile _file;
    private readonly MemoryMappedViewAccessor _view;
    private readonly byte* _base;
    private readonly long _spinTicks;

    private SharedStepSlot(string path, bool create, double spinS)
    {
        if (create)
        {
            using var fs = new FileStream(path, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.ReadWrite);
            fs.SetLength(Bytes);
        }
        _file = MemoryMappedFile.CreateFromFile(path, FileMode.Open, null, Bytes, MemoryMappedFileAccess.ReadWrite);
        _view = _file.CreateViewAccessor(0, Bytes);
        byte* p = null;
        _view.SafeMemoryMappedViewHandle.AcquirePointer(ref p);
        _base = p;
        _spinTicks = (long)(spinS * Stopwatch.Frequency);
    }

    /// <summary>How long a side spins (yielding its core between looks) before it sleeps [s]: longer than the plant computation between two tracker calls.</summary>
    public const double DefaultSpinS = 200e-6;

    /// <summary>Creates the slot file (which must not exist) and maps it.</summary>
    public static SharedStepSlot Create(string path, double spinS = DefaultSpinS) => new(path, true, spinS);

    /// <summary>Maps an existing slot file.</summary>
    public static SharedStepSlot Open(string path, double spinS = DefaultSpinS) => new(path, false, spinS);

    private ref long At64(int offset) => ref *(long*)(_base + offset);
    private ref int At32(int offset) => ref *(int*)(_base + offset);

    /// <summary>
    /// Arena: whether both sides yield their core between looks (more spinning waiters than cores) or spin
    /// without yielding; read by both sides on every wait.
    /// </summary>
    public bool ShareCores
    {
        get => Volatile.Read(ref At32(ShareCoresOffset)) != 0;
        set => Volatile.Write(ref At32(ShareCoresOffset), value ? 1 : 0);
    }

    /// <summary>Arena: publishes a measurement under <paramref name="sequence"/>; true if the host sleeps and needs a WAKE.</summary>
    public bool PublishRequest(long sequence, in TrackerMeasurement m)
    {
        var (vSum, iSum, n) = HostMessages.CodeSums(m);
        double* d = (double*)(_base + PayloadOffset);
        d[0] = m.TimeS;
        d[1] = m.VoltageV;
        d[2] = m.CurrentA;
        *(long*)(d + 3) = vSum;
        *(long*)(d + 4) = iSum;
        *(int*)(d + 5) = n;
        *((int*)(d + 5) + 1) = 0;
        d[6] = m.PreviousCommand;
        return Publish(RequestOffset, sequence, HostAsleepOffset);
    }

    /// <summary>Host: the measurement of the current request.</summary>
    public TrackerMeasurement ReadRequest()
    {
        double* d = (double*)(_base + PayloadOffset);
        int n = Math.Max(*(int*)(d + 5), 1);
        return new TrackerMeasurement(d[0], d[1], d[2], (double)*(long*)(d + 3) / n, (double)*(long*)(d + 4) / n, d[6], n);
    }

    /// <summary>Host: publishes the reply to <paramref name="sequence"/>; true if the arena sleeps and needs a WAKE.</summary>
    public bool PublishReply(long sequence, int status, double command)
    {
        At32(StatusOffset) = status;
        *(double*)(_base + CommandOffset) = command;
        return Publish(ReplyOffset, sequence, ArenaAsleepOffset);
    }

    /// <summary>Arena: the reply status and command.</summary>
    public (int Status, double Command) ReadReply() => (Volatile.Read(ref At32(StatusOffset)), *(double*)(_base + CommandOffset));

    /// <summary>Arena: waits until the reply sequence reaches <paramref name="sequence"/>; <paramref name="sleep"/> blocks until a WAKE and returns false if the peer is gone.</summary>
    public bool AwaitReply(long sequence, Func<bool> sleep) => Await(ReplyOffset, sequence, ArenaAsleepOffset, sleep);

    /// <summary>Host: waits until the request sequence passes <paramref name="last"/>; <paramref name="sleep"/> returns false to stop waiting (a pipe frame that is not WAKE, or the end).</summary>
    public bool AwaitRequest(long last, Func<bool> sleep) => Await(RequestOffset, last + 1, HostAsleepOffset, sleep);

    /// <summary>The request sequence now.</summary>
    public long RequestSequence => Volatile.Read(ref At64(RequestOffset));

    private bool Publish(int sequenceOffset, long sequence, int peerAsleepOffset)
    {
        Volatile.Write(ref At64(sequenceOffset), sequence);
        Interlocked.MemoryBarrier();
        return Volatile.Read(ref At32(peerAsleepOffset)) != 0;
    }

    private bool Await(int sequenceOffset, long atLeast, int ownAsleepOffset, Func<bool> sleep)
    {
        ref long seq = ref At64(sequenceOffset);
        if (Volatile.Read(ref seq) >= atLeast) return true;
        long start = Stopwatch.GetTimestamp();
        while (true)
        {
            for (int k = 0; k < 64; k++)
            {
                if (Volatile.Read(ref seq) >= atLeast) return true;
                Thread.SpinWait(8);
            }
            if (Stopwatch.GetTimestamp() - start < _spinTicks)
            {
                // Give the core away between looks where the peer may be waiting for one (more spinning threads
                // than cores, as in a sweep): it gets this one instead of waiting for the scheduler's next tick.
                if (Volatile.Read(ref At32(ShareCoresOffset)) != 0) Thread.Yield();
                continue;
            }
            Volatile.Write(ref At32(ownAsleepOffset), 1);
            Interlocked.MemoryBarrier();
            if (Volatile.Read(ref seq) >= atLeast)
            {
                Volatile.Write(ref At32(ownAsleepOffset), 0);
                return true;
            }
            bool awake = sleep();
            Volatile.Write(ref At32(ownAsleepOffset), 0);
            if (!awake) return Volatile.Read(ref seq) >= atLeast;
            start = Stopwatch.GetTimestamp();
        }
    }

    /// <summary>Unmaps the slot.</summary>
    public void Dispose()
    {
        _view.SafeMemoryMappedViewHandle.ReleasePointer();
        _view.Dispose();
        _file.Dispose();
    }
}
