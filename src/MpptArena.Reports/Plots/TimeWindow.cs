using System.Globalization;

namespace MpptArena.Reports.Plots;

/// <summary>The part of a run the time-series plots show: from <paramref name="StartS"/> to <paramref name="EndS"/> [s].</summary>
public sealed record TimeWindow(double StartS, double EndS)
{
    /// <summary>Parses START:END in seconds (either side may be left empty: ":60" or "120:"), against a run of <paramref name="durationS"/> [s].</summary>
    public static TimeWindow Parse(string text, double durationS, string option = "--window")
    {
        var parts = text.Split(':');
        if (parts.Length != 2) throw new ArenaInputException($"{option} '{text}' must look like START:END in seconds, e.g. 100:160", option);
        double start = parts[0].Length == 0 ? 0 : Number(parts[0], text, option);
        double end = parts[1].Length == 0 ? durationS : Number(parts[1], text, option);
        if (start < 0 || end <= start || start >= durationS)
        {
            throw new ArenaInputException($"{option} '{text}' must satisfy 0 <= START < END and START below the run's {durationS.ToString("G6", CultureInfo.InvariantCulture)} s", option);
        }
        return new TimeWindow(start, Math.Min(end, durationS));
    }

    /// <summary>True if <paramref name="timeS"/> lies in the window.</summary>
    public bool Contains(double timeS) => timeS >= StartS && timeS <= EndS;

    /// <summary>"t = START to END s" for titles.</summary>
    public override string ToString() =>
        string.Create(CultureInfo.InvariantCulture, $"t = {StartS:0.###} to {EndS:0.###} s");

    private static double Number(string part, string text, string option) =>
        double.TryParse(part, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v)
            ? v
            : throw new ArenaInputException($"{option} '{text}': '{part}' is not a number of seconds", option);
}
