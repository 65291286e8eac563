using System.Diagnostics;
using System.Globalization;

namespace MpptArena.Cli.Terminal;

/// <summary>
/// Progress for output that is not a terminal (CI logs): one plain line at most every
/// <see cref="IntervalS"/> seconds of wall time, so a long run or sweep shows it is alive without flooding the log.
/// </summary>
internal sealed class ProgressLines(string what) : IProgress<double>
{
    /// <summary>Least wall time between two lines [s].</summary>
    public const double IntervalS = 10;

    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly object _gate = new();
    private double _lastS;

    /// <summary>Reports a finished fraction [0, 1] (called from any thread).</summary>
    public void Report(double fraction)
    {
        double now = _clock.Elapsed.TotalSeconds;
        if (now - _lastS < IntervalS) return;
        lock (_gate)
        {
            if (now - _lastS < IntervalS) return;
            _lastS = now;
            StandardOutput.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"progress: {what}: {100 * fraction:0} % after {now:0} s"));
        }
    }
}
