using System.Globalization;

namespace MpptArena.Trackers.Isolation;

/// <summary>
/// One background thread that watches every live host: a call that outlasts its limit, or a resident set
/// above the memory limit, gets the host killed with the reason recorded, which ends the arena's blocked
/// read with a fault that names the broken budget. It also watches in-process calls that opted in, which
/// it cannot stop: it reports them through <see cref="InProcessCallOverrun"/>.
/// </summary>
public sealed class HostWatchdog
{
    private const int TickMs = 10;
    private const int MemoryEveryTicks = 5;

    private readonly List<TrackerHost> _hosts = [];
    private readonly List<InProcessCallWatch> _inProcess = [];
    private readonly object _lock = new();
    private Thread? _thread;

    /// <summary>The watchdog of this process.</summary>
    public static HostWatchdog Shared { get; } = new();

    /// <summary>Raised (on the watchdog's thread) when an in-process call outlasts its limit; the tracker name and the limit [s].</summary>
    public static event Action<string, double>? InProcessCallOverrun;

    internal void Register(TrackerHost host)
    {
        lock (_lock)
        {
            _hosts.Add(host);
            EnsureThread();
        }
    }

    internal void Unregister(TrackerHost host)
    {
        lock (_lock) _hosts.Remove(host);
    }

    internal void Register(InProcessCallWatch watch)
    {
        lock (_lock)
        {
            _inProcess.Add(watch);
            EnsureThread();
        }
    }

    internal void Unregister(InProcessCallWatch watch)
    {
        lock (_lock) _inProcess.Remove(watch);
    }

    private void EnsureThread()
    {
        if (_thread is not null) return;
        _thread = new Thread(Watch) { IsBackground = true, Name = "mppt-arena tracker watchdog" };
        _thread.Start();
    }

    private void Watch()
    {
        var c = CultureInfo.InvariantCulture;
        for (long tick = 0; ; tick++)
        {
            Thread.Sleep(TickMs);
            TrackerHost[] hosts;
            InProcessCallWatch[] watches;
            lock (_lock)
            {
                hosts = [.. _hosts];
                watches = [.. _inProcess];
            }
            foreach (var host in hosts)
            {
                var (elapsed, limit) = host.CallInProgress();
                if (elapsed > limit) host.KillFor(string.Format(c, "no reply within {0:0.###} s", limit));
                if (tick % MemoryEveryTicks != 0) continue;
                long? resident = host.ResidentBytes();
                if (resident > host.Limits.MemoryBytes)
                {
                    host.KillFor(string.Format(c, "exceeded {0:0.#} MiB of memory ({1:0.#} MiB resident)", host.Limits.MemoryMiB, resident.Value / 1048576.0));
                }
            }
            foreach (var w in watches)
            {
                if (w.Overran() is { } limit) InProcessCallOverrun?.Invoke(w.TrackerName, limit);
            }
        }
    }
}
