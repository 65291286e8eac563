using System.Globalization;
using MpptArena.Reports.Summary;
using MpptArena.Scenarios;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Reports.Comparison;

/// <summary>Tolerances per score key: the catalogue's defaults, overridden from a YAML file and the command line.</summary>
public sealed class ToleranceSet
{
    private readonly Dictionary<string, Tolerance> _overrides = new(StringComparer.Ordinal);

    /// <summary>Tolerance of a score key.</summary>
    public Tolerance For(string key)
    {
        if (_overrides.TryGetValue(key, out var t)) return t;
        if (key.StartsWith(ScoreCatalog.WindowPrefix, StringComparison.Ordinal) && _overrides.TryGetValue("window:*", out var w)) return w;
        var info = ScoreCatalog.Find(key);
        return info is null ? new Tolerance(0, 0) : new Tolerance(info.DefaultAbsoluteTolerance, info.DefaultRelativeTolerance);
    }

    /// <summary>Sets a tolerance for a key ("window:*" for every window).</summary>
    public void Set(string key, Tolerance tolerance) => _overrides[key] = tolerance;

    /// <summary>
    /// Reads a tolerance file: a mapping from score key to {absolute, relative}, e.g.
    /// <c>tracking_efficiency: { absolute: 0.002 }</c>.
    /// </summary>
    public void LoadYaml(string path)
    {
        var rootNode = YamlInput.ReadRoot(YamlInput.ReadText(path, "tolerance file"), path, "a mapping from score key to { absolute, relative }");
        if (rootNode is not YamlMappingNode root)
        {
            throw new ArenaInputException("expected a mapping from score key to { absolute, relative }", null, Where(path, rootNode));
        }
        foreach (var (k, v) in root.Children)
        {
            if (k is not YamlScalarNode { Value: { } key }) throw new ArenaInputException("expected a score key (text)", null, Where(path, k));
            if (key != "window:*" && ScoreCatalog.Find(key) is null)
            {
                throw new ArenaInputException($"unknown score '{key}'; known: {string.Join(", ", ScoreCatalog.All.Select(s => s.Key))}, window:NAME, window:*", key, Where(path, k));
            }
            if (v is not YamlMappingNode m) throw new ArenaInputException($"'{key}' must be a mapping with 'absolute' and/or 'relative'", key, Where(path, v));
            double abs = 0, rel = 0;
            foreach (var (fk, fv) in m.Children)
            {
                if (fk is not YamlScalarNode { Value: { } f }) throw new ArenaInputException($"expected 'absolute' or 'relative' under '{key}'", key, Where(path, fk));
                if (f is not ("absolute" or "relative")) throw new ArenaInputException($"unknown key '{f}' under '{key}'; expected absolute or relative", f, Where(path, fk));
                if (fv is not YamlScalarNode s || !double.TryParse(s.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out double x) || x < 0 || !double.IsFinite(x))
                {
                    throw new ArenaInputException($"'{key}.{f}' must be a number of at least 0", f, Where(path, fv));
                }
                if (f == "absolute") abs = x; else rel = x;
            }
            Set(key, new Tolerance(abs, rel));
        }
    }

    /// <summary>Parses "key=absolute[,relative]" from the command line.</summary>
    public void ParseOption(string text)
    {
        int eq = text.IndexOf('=');
        if (eq <= 0) throw new ArenaInputException($"--tolerance '{text}' must look like score=absolute[,relative], e.g. tracking_efficiency=0.002", "--tolerance");
        string key = text[..eq];
        if (key != "window:*" && ScoreCatalog.Find(key) is null) throw new ArenaInputException($"--tolerance: unknown score '{key}'", "--tolerance");
        var parts = text[(eq + 1)..].Split(',');
        double Parse(string s) => double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && v >= 0 && double.IsFinite(v)
            ? v : throw new ArenaInputException($"--tolerance: value '{s}' in '{text}' must be a finite number of at least 0", "--tolerance");
        Set(key, new Tolerance(Parse(parts[0]), parts.Length > 1 ? Parse(parts[1]) : 0));
    }

    private static SourceLocation Where(string file, YamlNode n) => new(file, n.Start.Line, n.Start.Column);
}
