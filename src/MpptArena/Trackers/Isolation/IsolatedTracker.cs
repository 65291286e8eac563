namespace MpptArena.Trackers.Isolation;

/// <summary>
/// A tracker that lives in a host process of its own: one instance per host, so its globals are its own,
/// and whatever it does (crash, exit, hang, allocate, print) ends in a <see cref="TrackerFault"/> for this
/// tracker alone.
/// </summary>
public sealed class IsolatedTracker : IMpptTracker, IContainedTracker, IDisposable
{
    private readonly TrackerHostLaunch _launch;
    private readonly KeyValuePair<string, double>[] _parameters;
    private readonly TrackerHostPool _pool;
    private TrackerHost? _host;
    private bool _created;
    private long _calls;
    private TextWriter? _log;
    private bool _counted;

    /// <summary>Isolated trackers with an instance in this process now: each keeps a host thread spinning between calls.</summary>
    private static int _active;

    /// <summary>True when the spinning waiters (an arena thread and a host thread per active isolated tracker, at most) outnumber the cores.</summary>
    private static bool Oversubscribed => 2 * Volatile.Read(ref _active) > System.Environment.ProcessorCount;

    /// <summary>An instance of the tracker <paramref name="launch"/> hosts, with checked settings.</summary>
    public IsolatedTracker(TrackerHostLaunch launch, HostHello hello, TrackerSettings settings, TrackerHostPool? pool = null)
    {
        _launch = launch;
        CommandKind = hello.CommandKind;
        _parameters = [.. settings.All];
        _pool = pool ?? TrackerHostPool.Shared;
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind { get; }

    /// <inheritdoc/>
    public TrackerLimits Limits { get; set; } = TrackerLimits.Default;

    /// <inheritdoc/>
    public TextWriter? Log
    {
        set
        {
            _log = value;
            if (_host is not null) _host.Log = value;
        }
    }

    /// <summary>The host process id while one is leased, for tests and diagnostics.</summary>
    public int? HostProcessId => _host?.ProcessId;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        if (_host is { Broken: false } && _created) _host.Destroy();
        if (_host is { Broken: true })
        {
            _pool.Return(_host);
            _host = null;
        }
        _host ??= _pool.Rent(_launch, Limits);
        if (!_counted)
        {
            Interlocked.Increment(ref _active);
            _counted = true;
        }
        _host.Limits = Limits;
        _host.Log = _log;
        _host.ResetCallTime();
        _calls = 0;
        _created = false;
        double first = _host.Create(context, _parameters);
        _created = true;
        return first;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement measurement)
    {
        var host = _host ?? throw new InvalidOperationException("Step before Reset");
        host.ShareCores = Oversubscribed;
        double command = host.Step(measurement, ++_calls);
        if (host.CallTicks > Limits.RunS * System.Diagnostics.Stopwatch.Frequency)
        {
            throw new TrackerFault(FormattableString.Invariant($"used more than its run limit of {Limits.RunS:0.###} s in calls (at t = {measurement.TimeS:0.###} s, call {_calls})"));
        }
        return command;
    }

    /// <summary>Destroys the instance and gives the host back for the next one.</summary>
    public void Dispose()
    {
        if (_counted)
        {
            Interlocked.Decrement(ref _active);
            _counted = false;
        }
        if (_host is null) return;
        if (!_host.Broken && _created)
        {
            try
            {
                _host.Destroy();
            }
            catch (TrackerFault)
            {
                // The host is now broken and will be ended by the pool.
            }
        }
        _pool.Return(_host);
        _host = null;
    }
}
