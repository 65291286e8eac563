using System.Diagnostics;

namespace MpptArena.Trackers.Isolation;

/// <summary>
/// Times the calls of a user's tracker that runs inside the arena (isolation: in_process). A call that
/// does not return cannot be stopped there; the watchdog reports it once, so a front end can end the run
/// with a message instead of hanging for ever.
/// </summary>
public sealed class InProcessCallWatch : IDisposable
{
    private readonly double _limitS;
    private long _startTicks;
    private bool _reported;

    /// <summary>Watches calls of <paramref name="trackerName"/> against <paramref name="limitS"/> [s].</summary>
    public InProcessCallWatch(string trackerName, double limitS)
    {
        TrackerName = trackerName;
        _limitS = limitS;
        HostWatchdog.Shared.Register(this);
    }

    /// <summary>The tracker watched.</summary>
    public string TrackerName { get; }

    /// <summary>Wall time of all calls so far [Stopwatch ticks].</summary>
    public long CallTicks { get; private set; }

    /// <summary>Marks the start of a call.</summary>
    public void Begin() => Volatile.Write(ref _startTicks, Stopwatch.GetTimestamp());

    /// <summary>Marks its end.</summary>
    public void End()
    {
        CallTicks += Stopwatch.GetTimestamp() - _startTicks;
        Volatile.Write(ref _startTicks, 0);
    }

    /// <summary>The limit [s] if the call in progress has outlasted it (once per watch), else null.</summary>
    internal double? Overran()
    {
        long start = Volatile.Read(ref _startTicks);
        if (start == 0 || _reported) return null;
        if ((Stopwatch.GetTimestamp() - start) / (double)Stopwatch.Frequency <= _limitS) return null;
        _reported = true;
        return _limitS;
    }

    /// <summary>Stops watching.</summary>
    public void Dispose() => HostWatchdog.Shared.Unregister(this);
}
