using System.Globalization;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers.Isolation;

namespace MpptArena.Cli.Commands;

/// <summary>--call-limit-ms, --run-limit-s and --memory-limit-mib: the same limits as a tracker entry's 'limits', for every tracker of the run.</summary>
internal static class LimitOptions
{
    public static Scenario Apply(Scenario s, ArgumentReader a)
    {
        double? call = Read(a, "--call-limit-ms", 1, 3_600_000), run = Read(a, "--run-limit-s", 0.001, 1e7), memory = Read(a, "--memory-limit-mib", 64, 1 << 20);
        if (call is null && run is null && memory is null) return s;
        return s with { Trackers = s.Trackers.Select(t => t with { Limits = With(t.Limits, call, run, memory) }).ToList() };
    }

    public static TrackerLimits With(TrackerLimits l, double? callMs, double? runS, double? memoryMiB) => new(
        callMs is { } c ? c * 1e-3 : l.CallS, runS ?? l.RunS, memoryMiB is { } m ? (long)(m * 1048576) : l.MemoryBytes);

    private static double? Read(ArgumentReader a, string option, double min, double max)
    {
        if (a.Option(option) is not { } text) return null;
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v) || v < min || v > max)
        {
            throw new ArenaInputException($"{option} '{text}' must be a number from {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)}", option);
        }
        return v;
    }
}
