using System.Diagnostics;
using MpptArena.Plant;
using MpptArena.Scoring;
using MpptArena.Sensing;
using MpptArena.Trackers;

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
    public double NextSeriesS;

    /// <summary>Checks a command against the contract; returns a failure reason or null.</summary>
    public string? Validate(double command)
    {
        // One comparison pair also rejects NaN (every comparison with NaN is false).
        if (command >= Context.MinCommand && command <= Context.MaxCommand) return null;
        if (!double.IsFinite(command)) return $"returned a non-finite command ({command})";
        return $"returned {command:G6}, outside the converter's range [{Context.MinCommand:G6}, {Context.MaxCommand:G6}]";
    }

    /// <summary>Calls the tracker, timing it and isolating any exception.</summary>
    public void Sample(in TrackerMeasurement m)
    {
        double next;
        bool timed = (Calls & (TimingStride - 1)) == 0;
        long start = timed ? Stopwatch.GetTimestamp() : 0;
        try
        {
            next = Tracker.Step(m);
        }
        catch (Exception ex)
        {
            Failure = new TrackerFailure(m.TimeS, $"threw {ex.GetType().Name}: {ex.Message}");
            return;
        }
        if (timed)
        {
            ComputeTicks += Stopwatch.GetTimestamp() - start;
            TimedCalls++;
        }
        Calls++;
        string? bad = Validate(next);
        if (bad is not null)
        {
            Failure = new TrackerFailure(m.TimeS, bad);
            return;
        }
        Command = next;
    }
}
