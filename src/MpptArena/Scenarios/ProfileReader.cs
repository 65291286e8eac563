using System.Globalization;
using MpptArena.Environment;
using MpptArena.Scoring;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// Reads a time profile: a single number (constant), or a list of segments, each a one-key mapping:
/// start, hold_s, step, ramp, points, repeat, en50530_ramps, cloud, csv.
/// </summary>
internal sealed class ProfileReader(string file, string baseDirectory, List<ScoringWindow> windows, List<string> sources)
{
    /// <summary>Most breakpoints a profile may expand to (repeats included): a day at 0.1 s resolution is 864 000.</summary>
    public const int MaxBreakpoints = 2_000_000;

    /// <summary>Longest time a profile segment may span [s]: about three years.</summary>
    public const double MaxSegmentS = 1e8;

    private double? _openCsvEndS;
    private SourceLocation? _openCsvAt;

    /// <summary>Profiles that end with a CSV file not marked hold_last: the run must not outlast them (<see cref="CheckCovers"/>).</summary>
    private readonly List<(double EndS, SourceLocation At, string Path)> _openEnded = [];

    /// <summary>
    /// Refuses a run longer than a profile that ends with a CSV file, unless that file says hold_last: a
    /// logger file that stops early would otherwise hold its last value silently.
    /// </summary>
    public void CheckCovers(double durationS)
    {
        foreach (var (end, at, path) in _openEnded.Where(o => o.EndS < durationS * (1 - 1e-12)))
        {
            throw new ArenaInputException($"'{path}' ends with a CSV file whose data stop at {end.ToString("0.###", CultureInfo.InvariantCulture)} s, before the run's {durationS.ToString("0.###", CultureInfo.InvariantCulture)} s; shorten simulation.duration_s, add data, or set 'hold_last: true' on the csv to keep its last value", "csv", at);
        }
    }

    private static readonly string[] SegmentKinds = ["start", "hold_s", "step", "ramp", "points", "repeat", "en50530_ramps", "cloud", "csv"];

    /// <summary>Reads the profile at <paramref name="key"/> of <paramref name="parent"/>.</summary>
    public PiecewiseLinearProfile Read(YamlMap parent, string key, double min, double max, bool irradiance)
    {
        var node = parent.Node(key)!;
        string path = $"{parent.Path}.{key}";
        if (node is YamlScalarNode)
        {
            double v = parent.Number(key, null, min, max);
            return PiecewiseLinearProfile.Constant(v);
        }
        if (node is not YamlSequenceNode seq)
        {
            throw parent.Error(node, $"'{path}' must be a number or a list of segments ({string.Join(", ", SegmentKinds)})", key);
        }
        ProfileBuilder? builder = null;
        Append(seq, path, ref builder, min, max, irradiance, depth: 0);
        if (builder is null) throw parent.Error(node, $"'{path}' has no segments", key);
        if (_openCsvEndS is { } end && end == builder.TimeS) _openEnded.Add((end, _openCsvAt!, path));
        return builder.Build();
    }

    private void Append(YamlSequenceNode seq, string path, ref ProfileBuilder? builder, double min, double max, bool irradiance, int depth)
    {
        int index = 0;
        foreach (var item in seq.Children)
        {
            var m = new YamlMap(item, file, $"{path}[{index}]", SegmentKinds);
            _openCsvEndS = null;
            if (m.Count != 1)
            {
                throw new ArenaInputException($"each segment of '{path}' has exactly one key ({string.Join(", ", SegmentKinds)}); this one has {m.Count}", "segment", m.Location);
            }
            if (m.Has("start"))
            {
                double v = m.Number("start", null, min, max);
                if (builder is null) builder = new ProfileBuilder(v);
                else builder.Step(v);
            }
            builder ??= new ProfileBuilder(FirstValue(m, min, max));
            if (m.Has("hold_s")) builder.Hold(m.Number("hold_s", null, 0, MaxSegmentS));
            if (m.Has("step")) builder.Step(m.Number("step", null, min, max));
            if (m.Has("ramp")) Ramp(m, builder, min, max);
            if (m.Has("points")) Points(m, builder, min, max);
            if (m.Has("repeat"))
            {
                var r = m.Map("repeat", ["times", "segments"])!;
                int times = r.Integer("times", null, 1, 100_000);
                var inner = r.Sequence("segments") ?? throw r.Error(r.Required("segments", "a list of segments"), "'segments' must be a list");
                if (inner.Children.Count == 0) throw r.Error(inner, "'segments' is empty: a repeat needs at least one segment", "segments");
                if (depth > 8) throw r.Error(inner, "repeat is nested too deeply (more than 8 levels)");
                for (int k = 0; k < times; k++)
                {
                    Append(inner, $"{r.Path}.segments", ref builder!, min, max, irradiance, depth + 1);
                    if (builder.Count > MaxBreakpoints)
                    {
                        throw r.Error(r.Node("times")!, $"the repeat expands the profile past {MaxBreakpoints} breakpoints (the limit); repeat fewer times or nest less", "times");
                    }
                }
            }
            if (m.Has("en50530_ramps")) StandardRamps(m, builder, irradiance);
            if (m.Has("cloud")) Cloud(m, builder, irradiance);
            if (m.Has("csv")) Csv(m, builder, min, max);
            index++;
        }
    }

    private static double FirstValue(YamlMap m, double min, double max)
    {
        if (m.Has("step")) return m.Number("step", null, min, max);
        throw new ArenaInputException("the first segment of a profile must give its starting value: 'start: VALUE' (or 'step: VALUE')", "start", m.Location);
    }

    private static void Ramp(YamlMap m, ProfileBuilder b, double min, double max)
    {
        var r = m.Map("ramp", ["to", "over_s", "rate_per_s"])!;
        double to = r.Number("to", null, min, max);
        if (r.Has("over_s") == r.Has("rate_per_s"))
        {
            throw new ArenaInputException($"'{r.Path}' needs exactly one of 'over_s' (duration, s) or 'rate_per_s' (slope, unit per second)", "ramp", r.Location);
        }
        if (r.Has("over_s")) b.Ramp(to, r.Number("over_s", null, 0, MaxSegmentS));
        else b.RampAtRate(to, r.Positive("rate_per_s"));
    }

    private void Points(YamlMap m, ProfileBuilder b, double min, double max)
    {
        var seq = m.Sequence("points")!;
        double t0 = b.TimeS, last = -1;
        int k = 0;
        foreach (var p in seq.Children)
        {
            if (p is not YamlSequenceNode pair || pair.Children.Count != 2)
            {
                throw m.Error(p, $"'{m.Path}.points[{k}]' must be a pair [time_s, value]");
            }
            double t = m.ParseNumber(pair.Children[0], "points", "a time in seconds");
            double v = m.ParseNumber(pair.Children[1], "points", "a value");
            if (t < last) throw m.Error(pair.Children[0], $"time goes backwards in '{m.Path}.points': {t} s comes after {last} s", "points");
            if (t < 0) throw m.Error(pair.Children[0], $"'{m.Path}.points' times are relative to the segment start and must not be negative", "points");
            if (v < min || v > max) throw m.Error(pair.Children[1], $"value {v} in '{m.Path}.points' is out of range: expected {min} to {max}", "points");
            b.LineTo(t0 + t, v);
            last = t;
            k++;
        }
    }

    private void StandardRamps(YamlMap m, ProfileBuilder b, bool irradiance)
    {
        var r = m.Map("en50530_ramps", ["range", "dwell_s", "max_slopes"])!;
        if (!irradiance) throw new ArenaInputException("en50530_ramps is an irradiance sequence; it cannot drive temperature", "en50530_ramps", r.Location);
        string range = r.Text("range", null, ["low", "high"]);
        double dwell = r.Number("dwell_s", En50530RampSequence.DwellS, 0.0, 3600);
        var blocks = range == "low" ? En50530RampSequence.LowRange : En50530RampSequence.HighRange;
        int maxSlopes = r.Integer("max_slopes", blocks.Count, 1, blocks.Count);
        var chosen = blocks.Skip(blocks.Count - maxSlopes).ToList(); // keep the steepest: the short ones
        var (low, high) = range == "low" ? (100.0, 500.0) : (300.0, 1000.0);
        var result = En50530RampSequence.Append(b, low, high, chosen, dwell);
        string group = $"en50530_{range}";
        foreach (var w in result)
        {
            windows.Add(new ScoringWindow($"{group}_{w.SlopeWm2PerS.ToString(CultureInfo.InvariantCulture)}_w_m2_s", w.StartS, w.EndS, w.SlopeWm2PerS, group));
        }
    }

    private static void Cloud(YamlMap m, ProfileBuilder b, bool irradiance)
    {
        var c = m.Map("cloud", ["shadowed_w_m2", "enhancement_fraction", "enhancement_s", "ramp_w_m2_per_s", "shadow_s"])!;
        if (!irradiance) throw new ArenaInputException("cloud is an irradiance segment; it cannot drive temperature", "cloud", c.Location);
        new CloudPassage(b.Value, c.Number("shadowed_w_m2", null, 0, 2000), c.Number("enhancement_fraction", 0.2, 0, 1),
            c.Number("enhancement_s", 4, 0, 600), c.Positive("ramp_w_m2_per_s", 100), c.Number("shadow_s", 10, 0, 36000)).AppendTo(b);
    }

    private void Csv(YamlMap m, ProfileBuilder b, double min, double max)
    {
        var c = m.Map("csv", ["file", "time_column", "value_column", "skip_header", "hold_last"])!;
        string name = c.Text("file");
        string full = System.IO.Path.IsPathRooted(name) ? name : System.IO.Path.Combine(baseDirectory, name);
        if (!System.IO.File.Exists(full)) throw new ArenaInputException($"CSV file '{name}' not found (looked in {full})", "file", c.Location);
        int tc = c.Integer("time_column", 1, 1, 1000) - 1, vc = c.Integer("value_column", 2, 1, 1000) - 1;
        if (tc == vc) throw c.Error((c.Node("value_column") ?? c.Node("time_column"))!, $"'value_column' and 'time_column' are both column {tc + 1}; the values must come from another column than the times", "value_column");
        bool skipHeader = c.Text("skip_header", "true", ["true", "false"]) == "true";
        bool holdLast = c.Text("hold_last", "false", ["true", "false"]) == "true";
        double t0 = b.TimeS, last = double.NegativeInfinity;
        int lineNo = 0, rows = 0;
        string text = YamlInput.ReadText(full, "CSV file");
        sources.Add($"csv {name} {ContentDigest.OfText(text)}");
        foreach (string line in text.Split('\n').Select(l => l.TrimEnd('\r')))
        {
            lineNo++;
            if (lineNo == 1 && skipHeader) continue;
            if (string.IsNullOrWhiteSpace(line) || line.TrimStart().StartsWith('#')) continue;
            var raw = line.Split(',');
            var cells = raw.Select(Unquote).ToArray();
            if (cells.Length <= Math.Max(tc, vc)) throw CsvError(name, lineNo, 1, $"expected at least {Math.Max(tc, vc) + 1} comma-separated columns");
            if (!double.TryParse(cells[tc], NumberStyles.Float, CultureInfo.InvariantCulture, out double t) || !double.IsFinite(t))
                throw CsvError(name, lineNo, ColumnOf(raw, tc), $"time '{cells[tc].Trim()}' is not a number (seconds)");
            if (!double.TryParse(cells[vc], NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
                throw CsvError(name, lineNo, ColumnOf(raw, vc), $"value '{cells[vc].Trim()}' is not a number");
            if (t < last) throw CsvError(name, lineNo, ColumnOf(raw, tc), $"time goes backwards: {t} s after {last} s");
            if (v < min || v > max) throw CsvError(name, lineNo, ColumnOf(raw, vc), $"value {v} is out of range {min} to {max}");
            if (rows == 0 && t < 0) throw CsvError(name, lineNo, ColumnOf(raw, tc), "times are relative to the segment start and must not be negative");
            b.LineTo(t0 + t, v);
            last = t;
            rows++;
        }
        if (rows == 0) throw new ArenaInputException($"CSV file '{name}' holds no data rows", "file", c.Location);
        if (!holdLast)
        {
            _openCsvEndS = b.TimeS;
            _openCsvAt = c.Location;
        }
    }

    /// <summary>A cell without the double quotes spreadsheets and loggers put around numbers ("12.5" reads as 12.5).</summary>
    private static string Unquote(string cell)
    {
        string t = cell.Trim();
        return t.Length >= 2 && t[0] == '"' && t[^1] == '"' ? t[1..^1].Replace("\"\"", "\"", StringComparison.Ordinal) : cell;
    }

    private static int ColumnOf(string[] cells, int index) => cells.Take(index).Sum(c => c.Length + 1) + 1;

    private static ArenaInputException CsvError(string file, int line, int column, string message) =>
        new(message, "csv", new SourceLocation(file, line, column));
}
