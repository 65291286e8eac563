using System.Diagnostics;
using MpptArena.Plant;
using MpptArena.Scoring;
using MpptArena.Sensing;
using MpptArena.Trackers;
using MpptArena.Trackers.Isolation;

namespace MpptArena.Runs;

/// <summary>One tracker with its own copy of the plant, its sensors, its scorer and its series sink.</summary>
internal sealed class TrackerLane
{
    public required TrackerSpec Spec { get; init; }
    public required IMpptTracker Tracker { get; init; }
    public required IFrontEnd FrontEnd { get; init; }
    public required SensorChain Sensors { get; init; }
    public required TrackerScorer Scorer { get; init; }
    public required TrackerContext Context { get; init; }
    public required int StepsPerSample { get; init; }
    public ISeriesSink? Sink { get; init; }

    /// <summary>Watches a user's in-process calls (null for built-ins and isolated trackers).</summary>
    public InProcessCallWatch? Watch { get; init; }

    /// <summary>The tracker's log (synchronised), or null.</summary>
    public TextWriter? Log { get; init; }

    /// <summary>How many calls the failure record keeps.</summary>
    public const int RecentCalls = 8;
    private readonly TrackerExchange[] _recent = new TrackerExchange[RecentCalls];

    public double Command;
    public TrackerFailure? Failure;
    public long Calls;
    public long ComputeTicks;
    public long TimedCalls;

    /// <summary>One call in this many is timed: reading the clock costs more than many trackers' work.</summary>
    public const int TimingStride = 16;

    // Series downsampling: means over the interval.
    public double SumV, SumI, SumP, SumPmpp;
    public int SeriesCount;
    public double SumInductorA, SumDuty, SeriesDiscontinuousS;
    public double NextSeriesS;

    /// <summary>Checks a command against the contract; returns a failure reason or null.</summary>
    public string? Validate(double command)
    {
        // One comparison pair also rejects NaN (every comparison with NaN is false).
        if (command >= Context.MinCommand && command <= Context.MaxCommand) return null;
        if (!double.IsFinite(command)) return $"returned a non-finite command ({command})";
        return $"returned {command:G6}, outside the converter's range [{Context.MinCommand:G6}, {Context.MaxCommand:G6}]";
    }

    /// <summary>Calls Reset, turning whatever goes wrong into this tracker's failure.</summary>
    public void Start()
    {
        try
        {
            Watch?.Begin();
            double first = Tracker.Reset(Context);
            Watch?.End();
            string? bad = Validate(first);
            if (bad is not null) Fail(new TrackerFailure(0, bad + " from Reset"));
            else Command = first;
        }
        catch (TrackerFault fault)
        {
            Fail(new TrackerFailure(0, fault.Reason) { Details = fault.Details });
        }
        catch (Exception ex)
        {
            Fail(new TrackerFailure(0, $"threw {ex.GetType().Name} in Reset: {ex.Message}") { Details = ex.ToString() });
        }
    }

    /// <summary>Calls the tracker, timing it and isolating any exception.</summary>
    public void Sample(in TrackerMeasurement m)
    {
        double next;
        bool timed = (Calls & (TimingStride - 1)) == 0;
        long start = timed ? Stopwatch.GetTimestamp() : 0;
        ref var slot = ref _recent[Calls % RecentCalls];
        slot = new TrackerExchange(m.TimeS, m.VoltageV, m.CurrentA, double.NaN);
        try
        {
            Watch?.Begin();
            next = Tracker.Step(m);
            Watch?.End();
        }
        catch (TrackerFault fault)
        {
            Calls++;
            Fail(new TrackerFailure(m.TimeS, fault.Reason) { Details = fault.Details });
            return;
        }
        catch (Exception ex)
        {
            Calls++;
            Fail(new TrackerFailure(m.TimeS, $"threw {ex.GetType().Name}: {ex.Message} (call {Calls})") { Details = ex.ToString() });
            return;
        }
        if (timed)
        {
            ComputeTicks += Stopwatch.GetTimestamp() - start;
            TimedCalls++;
        }
        Calls++;
        slot = slot with { Command = next };
        if (Watch is not null && Watch.CallTicks > Spec.Limits.RunS * Stopwatch.Frequency)
        {
            Fail(new TrackerFailure(m.TimeS, FormattableString.Invariant($"used more than its run limit of {Spec.Limits.RunS:0.###} s in calls (call {Calls})")));
            return;
        }
        string? bad = Validate(next);
        if (bad is not null)
        {
            Fail(new TrackerFailure(m.TimeS, $"{bad} (call {Calls})"));
            return;
        }
        Command = next;
    }

    /// <summary>Records the failure with the last calls and releases the tracker (its host goes at once).</summary>
    public void Fail(TrackerFailure failure)
    {
        long n = Math.Min(Calls, RecentCalls);
        var recent = new List<TrackerExchange>((int)n);
        for (long k = Calls - n; k < Calls; k++) recent.Add(_recent[k % RecentCalls]);
        Failure = failure with { Recent = recent };
        if (Log is not null)
        {
            Log.WriteLine($"mppt-arena: tracker '{Spec.Name}' stopped at t = {failure.TimeS.ToString("0.######", System.Globalization.CultureInfo.InvariantCulture)} s: {failure.Reason}");
            if (failure.Details.Length > 0) Log.WriteLine(failure.Details);
            Log.Flush();
        }
        Release();
    }

    /// <summary>Disposes the tracker and its watch, once.</summary>
    public void Release()
    {
        if (_released) return;
        _released = true;
        Watch?.Dispose();
        (Tracker as IDisposable)?.Dispose();
    }

    private bool _released;
}
