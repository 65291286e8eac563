namespace MpptArena.Trackers.Isolation;

/// <summary>Tracker kinds whose instances run in host processes.</summary>
public static class IsolatedTrackers
{
    /// <summary>
    /// Starts a host for <paramref name="launch"/> to learn what it offers (HELLO), gives the host back to the
    /// pool for the run's first instance, and returns a descriptor whose instances each get a host of their own.
    /// </summary>
    /// <exception cref="TrackerFault">The host could not start or did not say HELLO.</exception>
    public static TrackerDescriptor Describe(string kind, TrackerHostLaunch launch, string source, TrackerOrigin origin, string? originPath, string? summary = null)
    {
        var pool = TrackerHostPool.Shared;
        var host = pool.Rent(launch, TrackerLimits.Default);
        var hello = host.Hello;
        pool.Return(host);
        return new TrackerDescriptor(kind, summary ?? hello.Summary, source, hello.Parameters, s => new IsolatedTracker(launch, hello, s, pool))
        {
            Origin = origin,
            OriginPath = originPath,
            Isolation = IsolationMode.Process,
            DeclaredCommandKind = hello.CommandKind,
        };
    }
}
