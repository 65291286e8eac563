using ScottPlot;

namespace MpptArena.Reports.Plots;

/// <summary>
/// One colour per tracker, the same in every plot of a run (by the tracker's place in the scenario). Red,
/// grey and black are left out: they mark the MPP, the local maxima and the curves themselves.
/// </summary>
public sealed class TrackerPalette
{
    // Category10 without its red (index 3) and grey (index 7), then darker and lighter variants of the same.
    private static readonly Color[] Base = [.. new[] { 0, 1, 2, 4, 5, 6, 8, 9 }.Select(i => new ScottPlot.Palettes.Category10().GetColor(i))];

    /// <summary>Colour of the global MPP marker; no tracker uses it.</summary>
    public static Color Mpp => Colors.Red;

    private readonly Dictionary<string, Color> _byName;

    /// <summary>Colours for the trackers in scenario order.</summary>
    public TrackerPalette(IEnumerable<string> trackerNames) =>
        _byName = trackerNames.Select((n, i) => (n, i)).ToDictionary(x => x.n, x => ColourAt(x.i));

    /// <summary>The tracker's colour (a fixed fallback for a name not in the run).</summary>
    public Color this[string trackerName] => _byName.TryGetValue(trackerName, out var c) ? c : Colors.DarkSlateBlue;

    /// <summary>The colour of place <paramref name="index"/> (0-based).</summary>
    public static Color ColourAt(int index)
    {
        var c = Base[index % Base.Length];
        int round = index / Base.Length;
        return round == 0 ? c : round % 2 == 1 ? c.Darken(0.35) : c.Lighten(0.35);
    }
}
