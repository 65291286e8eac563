namespace MpptArena.Trackers;

/// <summary>
/// The contract every tracker implements, built-in or a user's.
/// </summary>
/// <remarks>
/// Timing: the arena calls <see cref="Step"/> at t_k = k T (k = 1, 2, ...), T the tracker's sample
/// period. The measurement is the average of the ADC conversions taken in the averaging window that
/// ends at t_k. The returned command takes effect at t_k (zero-order hold) and stays in force until
/// the next call returns; the converter's own dynamics then move the PV voltage. Between t = 0 and
/// t_1 the command returned by <see cref="Reset"/> is in force. Compute time is not simulated; it is
/// measured and reported.
/// A tracker that throws, or returns NaN, infinity or a command outside [MinCommand, MaxCommand], is
/// stopped and reported as failed; the other trackers of the run carry on.
/// </remarks>
public interface IMpptTracker
{
    /// <summary>What the returned numbers mean.</summary>
    TrackerCommandKind CommandKind { get; }

    /// <summary>Clears all state and returns the command to apply from t = 0.</summary>
    /// <param name="context">Hardware the tracker runs on.</param>
    double Reset(TrackerContext context);

    /// <summary>One sample: returns the new command [V or -].</summary>
    /// <param name="measurement">Sensed values at this sample.</param>
    double Step(in TrackerMeasurement measurement);
}
