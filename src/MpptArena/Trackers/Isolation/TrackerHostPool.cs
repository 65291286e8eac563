using System.Collections.Concurrent;

namespace MpptArena.Trackers.Isolation;

/// <summary>
/// Idle hosts kept for reuse, so that a sweep pays host start-up once per worker and not once per case. Only
/// reusable launches (the arena's own host, which gives each instance fresh globals) are kept; a broken host
/// is never returned. Hosts left idle are ended when the process exits.
/// </summary>
public sealed class TrackerHostPool
{
    private readonly ConcurrentDictionary<string, ConcurrentBag<TrackerHost>> _idle = new();
    private readonly int _maxIdlePerKind;

    /// <summary>A pool keeping at most <paramref name="maxIdlePerKind"/> idle hosts per launch.</summary>
    public TrackerHostPool(int maxIdlePerKind)
    {
        _maxIdlePerKind = maxIdlePerKind;
        AppDomain.CurrentDomain.ProcessExit += (_, _) => Clear();
    }

    /// <summary>The pool of this process: two idle hosts per core and launch.</summary>
    public static TrackerHostPool Shared { get; } = new(2 * System.Environment.ProcessorCount);

    /// <summary>Hosts started since the process began (a measure of reuse) [-].</summary>
    public int Started => _started;

    private int _started;

    /// <summary>An idle host for <paramref name="launch"/>, or a new one.</summary>
    public TrackerHost Rent(TrackerHostLaunch launch, TrackerLimits limits)
    {
        if (launch.Reusable && _idle.TryGetValue(Key(launch, limits), out var bag))
        {
            while (bag.TryTake(out var host))
            {
                if (!host.Broken)
                {
                    host.Limits = limits;
                    return host;
                }
                host.Dispose();
            }
        }
        Interlocked.Increment(ref _started);
        return TrackerHost.Start(launch, limits);
    }

    /// <summary>Takes a host back: kept if it is healthy and reusable, ended otherwise.</summary>
    public void Return(TrackerHost host)
    {
        host.Log = null;
        if (host.Broken || !host.Launch.Reusable)
        {
            host.Dispose();
            return;
        }
        var bag = _idle.GetOrAdd(Key(host.Launch, host.Limits), _ => []);
        if (bag.Count >= _maxIdlePerKind)
        {
            host.Dispose();
            return;
        }
        bag.Add(host);
    }

    /// <summary>Ends every idle host.</summary>
    public void Clear()
    {
        foreach (var bag in _idle.Values)
        {
            while (bag.TryTake(out var host)) host.Dispose();
        }
    }

    private static string Key(TrackerHostLaunch launch, TrackerLimits limits) => $"{launch.Key}\u0002{limits.MemoryBytes}";
}
