using System.Diagnostics;
using System.Globalization;

namespace MpptArena.Trackers.Isolation;

/// <summary>
/// One running host process and the arena's end of its protocol: frames on the host's standard input and
/// output, steps through a shared slot where the host offers one, its standard error into the tracker's log.
/// Every way the process can go wrong (crash, exit, silence, garbage, memory) ends in a <see cref="TrackerFault"/>
/// that says what happened and when; nothing it does reaches the arena's own streams.
/// </summary>
public sealed class TrackerHost : IDisposable
{
    private const int TailLines = 20;
    private const long LogCapBytes = 16L << 20;

    private readonly Process _process;
    private readonly Stream _toHost;
    private readonly FrameReader _reader;
    private readonly FrameBuilder _builder = new();
    private readonly Queue<string> _tail = new();
    private readonly object _logLock = new();
    private SharedStepSlot? _slot;
    private string? _slotFolder;
    private TextWriter? _log;
    private long _logBytes;
    private long _sequence;
    private long _callStartTicks;
    private double _callLimitS;
    private volatile string? _watchdogFault;
    private bool _pendingFrame;

    private TrackerHost(TrackerHostLaunch launch, TrackerLimits limits, Process process)
    {
        Launch = launch;
        Limits = limits;
        _process = process;
        _toHost = process.StandardInput.BaseStream;
        _reader = new FrameReader(process.StandardOutput.BaseStream);
        ProcessId = process.Id;
    }

    /// <summary>How it was started.</summary>
    public TrackerHostLaunch Launch { get; }

    /// <summary>Limits in force; the call limit may change between leases, the memory limit is fixed at start.</summary>
    public TrackerLimits Limits { get; set; }

    /// <summary>What the host said about its tracker.</summary>
    public HostHello Hello { get; private set; } = null!;

    /// <summary>Operating-system process id.</summary>
    public int ProcessId { get; }

    /// <summary>True once the process died, was killed or broke the protocol; a broken host is never reused.</summary>
    public bool Broken { get; private set; }

    /// <summary>True while steps go through a shared slot.</summary>
    public bool UsesSharedSlot => _slot is not null;

    /// <summary>Wall time spent in calls since the last <see cref="ResetCallTime"/> [Stopwatch ticks].</summary>
    public long CallTicks { get; private set; }

    /// <summary>Where the host's standard error goes (the tracker's log), or null to keep only the last lines.</summary>
    public TextWriter? Log
    {
        set
        {
            lock (_logLock)
            {
                _log = value;
                _logBytes = 0;
            }
        }
    }

    /// <summary>Starts a host and reads its HELLO.</summary>
    /// <param name="launch">What to start.</param>
    /// <param name="limits">Limits; the memory limit applies for the life of the process.</param>
    /// <param name="useSharedSlot">Use the shared slot if the host offers it.</param>
    /// <exception cref="TrackerFault">The process could not start, died, or did not say HELLO properly.</exception>
    public static TrackerHost Start(TrackerHostLaunch launch, TrackerLimits limits, bool useSharedSlot = true)
    {
        Process process;
        try
        {
            process = Process.Start(launch.StartInfo(limits)) ?? throw new TrackerFault($"{launch.Description}: the process did not start");
        }
        catch (System.ComponentModel.Win32Exception ex)
        {
            throw new TrackerFault($"{launch.Description}: '{launch.FileName}' could not be started ({ex.Message})");
        }
        var host = new TrackerHost(launch, limits, process);
        process.ErrorDataReceived += (_, e) => host.OnErrorLine(e.Data);
        process.BeginErrorReadLine();
        HostWatchdog.Shared.Register(host);
        try
        {
            host.Begin(TrackerLimits.StartS);
            host.Hello = host.ReadFrame("while starting", FrameType.Hello, HostMessages.ReadHello);
            host.End();
            if (host.Hello.ProtocolVersion != HostProtocol.Version)
            {
                throw host.Fail($"speaks tracker host protocol {host.Hello.ProtocolVersion}; this mppt-arena speaks {HostProtocol.Version}", "while starting", kill: true);
            }
            if (useSharedSlot && (host.Hello.Flags & HostProtocol.SharedSlotFlag) != 0) host.MapSlot();
            return host;
        }
        catch
        {
            host.Dispose();
            throw;
        }
    }

    /// <summary>Makes a fresh tracker instance in the host; returns its command for t = 0.</summary>
    public double Create(TrackerContext context, IReadOnlyList<KeyValuePair<string, double>> parameters)
    {
        const string phase = "during create";
        Begin(Limits.CallS);
        Send(HostMessages.Create(_builder, context, parameters), phase);
        double first = ReadFrame(phase, FrameType.Created, r => r.F64());
        End();
        return first;
    }

    /// <summary>Whether both sides of the shared slot yield their core between looks (see <see cref="SharedStepSlot.ShareCores"/>); true by default.</summary>
    public bool ShareCores
    {
        get => _slot?.ShareCores ?? true;
        set
        {
            if (_slot is not null && _slot.ShareCores != value) _slot.ShareCores = value;
        }
    }

    /// <summary>One step: sends the measurement, returns the command.</summary>
    /// <param name="m">The measurement.</param>
    /// <param name="call">Number of this call in the run, for messages [-].</param>
    /// <exception cref="TrackerFault">The tracker threw, or its host failed.</exception>
    public double Step(in TrackerMeasurement m, long call)
    {
        long seq = ++_sequence;
        Begin(Limits.CallS);
        if (_slot is null)
        {
            Send(HostMessages.Step(_builder, (uint)seq, m), null, m.TimeS, call);
            var (s, command) = ReadFrame(null, FrameType.Command, r => (r.U32(), r.F64()), m.TimeS, call);
            if (s != (uint)seq) throw Fail($"answered step {s} when step {(uint)seq} was asked (a stray write to the protocol stream?)", StepPhase(m.TimeS, call), kill: true);
            End();
            return command;
        }
        if (_slot.PublishRequest(seq, m)) Send(_builder.Begin(FrameType.Wake), null, m.TimeS, call);
        if (!_slot.AwaitReply(seq, SleepUntilWake) && !_pendingFrame) throw Fail(null, StepPhase(m.TimeS, call), kill: false);
        if (_pendingFrame)
        {
            _pendingFrame = false;
            throw FromFrame(StepPhase(m.TimeS, call));
        }
        var (status, value) = _slot.ReadReply();
        if (status != 0)
        {
            if (!_reader.NextSkippingWakes()) throw Fail(null, StepPhase(m.TimeS, call), kill: false);
            throw FromFrame(StepPhase(m.TimeS, call));
        }
        End();
        return value;
    }

    /// <summary>Drops the instance; the host stays for the next one.</summary>
    public void Destroy()
    {
        const string phase = "during destroy";
        Begin(Limits.CallS);
        Send(_builder.Begin(FrameType.Destroy), phase);
        ReadFrame(phase, FrameType.Destroyed, _ => 0);
        End();
    }

    /// <summary>Starts a new run's account of call time.</summary>
    public void ResetCallTime() => CallTicks = 0;

    /// <summary>Called by the watchdog: records why and kills the process, which ends any blocked read.</summary>
    internal void KillFor(string reason)
    {
        _watchdogFault ??= reason;
        try
        {
            _process.Kill(entireProcessTree: true);
        }
        catch (Exception ex) when (ex is InvalidOperationException or System.ComponentModel.Win32Exception)
        {
            // Already gone.
        }
    }

    /// <summary>Wall time the current call has taken [s], or null when no call is in progress; and its limit [s].</summary>
    internal (double? ElapsedS, double LimitS) CallInProgress()
    {
        long start = Volatile.Read(ref _callStartTicks);
        return (start == 0 ? null : (Stopwatch.GetTimestamp() - start) / (double)Stopwatch.Frequency, _callLimitS);
    }

    /// <summary>Resident memory of the host process [bytes], or null if it cannot be read.</summary>
    internal long? ResidentBytes()
    {
        try
        {
            if (OperatingSystem.IsLinux())
            {
                string statm = File.ReadAllText($"/proc/{ProcessId}/statm");
                string[] fields = statm.Split(' ');
                return long.Parse(fields[1], CultureInfo.InvariantCulture) * System.Environment.SystemPageSize;
            }
            _process.Refresh();
            return _process.HasExited ? null : _process.WorkingSet64;
        }
        catch (Exception ex) when (ex is IOException or InvalidOperationException or FormatException or IndexOutOfRangeException or UnauthorizedAccessException)
        {
            return null;
        }
    }

    private void MapSlot()
    {
        string root = Directory.Exists("/dev/shm") ? "/dev/shm" : Path.GetTempPath();
        _slotFolder = Path.Combine(root, $"mppt-arena-{System.Environment.ProcessId}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(_slotFolder);
        string path = Path.Combine(_slotFolder, "slot");
        _slot = SharedStepSlot.Create(path);
        _slot.ShareCores = true;
        Begin(TrackerLimits.StartS);
        Send(_builder.Begin(FrameType.Map).Text(path), "while mapping its slot");
        ReadFrame("while mapping its slot", FrameType.Mapped, _ => 0);
        End();
    }

    private bool SleepUntilWake()
    {
        bool got;
        try
        {
            got = _reader.Next();
        }
        catch (ProtocolException)
        {
            return false;
        }
        if (!got) return false;
        if (_reader.Type == FrameType.Wake) return true;
        _pendingFrame = true;
        return false;
    }

    private void Begin(double limitS)
    {
        _callLimitS = limitS;
        Volatile.Write(ref _callStartTicks, Stopwatch.GetTimestamp());
    }

    private void End()
    {
        if (_callStartTicks != 0) CallTicks += Stopwatch.GetTimestamp() - _callStartTicks;
        Volatile.Write(ref _callStartTicks, 0);
    }

    private void Send(FrameBuilder frame, string? phase, double timeS = 0, long call = 0)
    {
        try
        {
            frame.SendTo(_toHost);
        }
        catch (IOException)
        {
            throw Fail(null, phase ?? StepPhase(timeS, call), kill: false);
        }
    }

    private T ReadFrame<T>(string? phase, FrameType expected, Func<FrameReader, T> decode, double timeS = 0, long call = 0)
    {
        string where = phase ?? StepPhase(timeS, call);
        try
        {
            if (!_reader.NextSkippingWakes()) throw Fail(null, where, kill: false);
            if (_reader.Type == FrameType.Error) throw FromFrame(where);
            if (_reader.Type != expected) throw Fail($"sent a {_reader.Type} frame where {expected} was expected", where, kill: true);
            return decode(_reader);
        }
        catch (ProtocolException ex)
        {
            throw Fail($"broke the tracker host protocol ({ex.Message})", where, kill: true);
        }
        catch (IOException)
        {
            throw Fail(null, where, kill: false);
        }
    }

    private TrackerFault FromFrame(string phase)
    {
        End();
        if (_reader.Type != FrameType.Error) return Fail($"sent a {_reader.Type} frame in the middle of a step", phase, kill: true);
        string kind = _reader.Text(), message = _reader.Text(), details = _reader.Text();
        return new TrackerFault($"{kind}: {message} ({phase})".Trim(), details);
    }

    private static string StepPhase(double timeS, long call) =>
        string.Create(CultureInfo.InvariantCulture, $"during step at t = {timeS:0.###} s, call {call}");

    /// <summary>Marks the host broken and names what happened: the watchdog's reason, or how the process ended.</summary>
    private TrackerFault Fail(string? reason, string phase, bool kill)
    {
        Volatile.Write(ref _callStartTicks, 0);
        Broken = true;
        if (kill) KillFor(reason ?? "killed by the arena");
        bool exited = _process.WaitForExit(2000);
        if (!exited)
        {
            KillFor(reason ?? "stopped answering");
            exited = _process.WaitForExit(5000);
        }
        if (exited) _process.WaitForExit();
        string what = _watchdogFault ?? reason ?? (exited ? ExitDescription.Of(_process.ExitCode) : "stopped answering and could not be killed");
        string tail;
        lock (_logLock) tail = string.Join('\n', _tail);
        return new TrackerFault($"{what} {phase}", tail);
    }

    private void OnErrorLine(string? line)
    {
        if (line is null) return;
        lock (_logLock)
        {
            if (_tail.Count == TailLines) _tail.Dequeue();
            _tail.Enqueue(line);
            if (_log is null || _logBytes > LogCapBytes) return;
            _logBytes += line.Length + 1;
            _log.WriteLine(_logBytes > LogCapBytes ? "[mppt-arena: log truncated at 16 MiB]" : line);
            _log.Flush();
        }
    }

    /// <summary>Ends the host: closes its input (a healthy host exits), then kills what is left.</summary>
    public void Dispose()
    {
        HostWatchdog.Shared.Unregister(this);
        try
        {
            _toHost.Dispose();
        }
        catch (IOException)
        {
            // The host is gone already.
        }
        if (!_process.WaitForExit(1000))
        {
            KillFor("closed by the arena");
            _process.WaitForExit(5000);
        }
        _slot?.Dispose();
        if (_slotFolder is not null)
        {
            try
            {
                Directory.Delete(_slotFolder, true);
            }
            catch (IOException)
            {
                // Left for the system's temp cleaner.
            }
        }
        Log = null;
        _process.Dispose();
    }
}
