namespace MpptArena.Trackers.Isolation;

/// <summary>A tracker the arena contains: it takes limits and a log before its first Reset.</summary>
public interface IContainedTracker
{
    /// <summary>Limits in force from the next Reset.</summary>
    TrackerLimits Limits { get; set; }

    /// <summary>Where the tracker's own output goes, or null.</summary>
    TextWriter? Log { set; }
}
