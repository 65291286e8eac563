using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// A YAML mapping read with its position in the file: unknown keys, missing keys, wrong types and
/// out-of-range values are reported with file, line and column and what was expected.
/// </summary>
internal sealed class YamlMap
{
    private readonly YamlMappingNode _node;
    private readonly Dictionary<string, (YamlNode Key, YamlNode Value)> _entries = new(StringComparer.Ordinal);

    /// <summary>Reads <paramref name="node"/> as a mapping whose keys must all be in <paramref name="allowed"/>.</summary>
    public YamlMap(YamlNode node, string file, string path, IReadOnlyCollection<string> allowed)
    {
        File = file;
        Path = path;
        if (node is not YamlMappingNode map)
        {
            throw Error(node, $"'{path}' must be a mapping of keys to values (one of: {string.Join(", ", allowed)})", path);
        }
        _node = map;
        foreach (var (k, v) in map.Children)
        {
            string key = k is YamlScalarNode s ? s.Value ?? "" : "";
            if (!allowed.Contains(key))
            {
                throw Error(k, $"unknown key '{key}' in '{path}'; expected one of: {string.Join(", ", allowed)}", key);
            }
            if (!_entries.TryAdd(key, (k, v))) throw Error(k, $"key '{key}' appears twice in '{path}'", key);
        }
    }

    /// <summary>File the mapping came from.</summary>
    public string File { get; }

    /// <summary>Dotted path of the mapping in the document.</summary>
    public string Path { get; }

    /// <summary>Digest of the mapping as loaded (<see cref="ContentDigest.OfYaml"/>).</summary>
    public string Digest => ContentDigest.OfYaml(_node);

    /// <summary>Number of keys present.</summary>
    public int Count => _entries.Count;

    /// <summary>True if <paramref name="key"/> is present.</summary>
    public bool Has(string key) => _entries.ContainsKey(key);

    /// <summary>The node of <paramref name="key"/>, or null.</summary>
    public YamlNode? Node(string key) => _entries.TryGetValue(key, out var e) ? e.Value : null;

    /// <summary>Location of the mapping itself.</summary>
    public SourceLocation Location => Where(_node);

    /// <summary>Location of a node in this file.</summary>
    public SourceLocation Where(YamlNode node) => new(File, node.Start.Line, node.Start.Column);

    /// <summary>An input error at <paramref name="node"/>.</summary>
    public ArenaInputException Error(YamlNode node, string message, string? field = null) => new(message, field, Where(node));

    /// <summary>A required key's node; error at the mapping if missing.</summary>
    public YamlNode Required(string key, string expected)
    {
        if (_entries.TryGetValue(key, out var e)) return e.Value;
        throw new ArenaInputException($"missing required key '{key}' in '{Path}': expected {expected}", key, Location);
    }

    /// <summary>A number; <paramref name="fallback"/> when absent (null makes it required).</summary>
    public double Number(string key, double? fallback = null, double min = double.NegativeInfinity, double max = double.PositiveInfinity,
        bool exclusiveMin = false, string? expected = null)
    {
        string what = expected ?? DescribeRange(min, max, exclusiveMin);
        var node = _entries.TryGetValue(key, out var e) ? e.Value : null;
        if (node is null)
        {
            if (fallback is { } f) return f;
            throw new ArenaInputException($"missing required key '{key}' in '{Path}': expected {what}", key, Location);
        }
        double value = ParseNumber(node, key, what);
        if (value < min || value > max || (exclusiveMin && value <= min))
        {
            throw Error(node, $"'{Path}.{key}' = {Scalar(node)} is out of range: expected {what}", key);
        }
        return value;
    }

    /// <summary>A positive number (physical quantities that cannot be zero).</summary>
    public double Positive(string key, double? fallback = null, double max = double.PositiveInfinity) =>
        Number(key, fallback, 0, max, exclusiveMin: true,
            expected: double.IsPositiveInfinity(max) ? "a number greater than zero" : $"a number greater than zero and at most {max.ToString(CultureInfo.InvariantCulture)}");

    /// <summary>A whole number.</summary>
    public int Integer(string key, int? fallback = null, int min = int.MinValue, int max = int.MaxValue)
    {
        string what = DescribeRange(min, max, false, whole: true);
        var node = _entries.TryGetValue(key, out var e) ? e.Value : null;
        if (node is null)
        {
            if (fallback is { } f) return f;
            throw new ArenaInputException($"missing required key '{key}' in '{Path}': expected {what}", key, Location);
        }
        string text = Scalar(node, key, what);
        if (!long.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out long v) || v < min || v > max)
        {
            throw Error(node, $"'{Path}.{key}' = {text} is not valid: expected {what}", key);
        }
        return (int)v;
    }

    /// <summary>A string; <paramref name="fallback"/> when absent (null makes it required).</summary>
    public string Text(string key, string? fallback = null, IReadOnlyCollection<string>? oneOf = null)
    {
        string what = oneOf is null ? "a text value" : $"one of: {string.Join(", ", oneOf)}";
        var node = _entries.TryGetValue(key, out var e) ? e.Value : null;
        if (node is null)
        {
            if (fallback is not null) return fallback;
            throw new ArenaInputException($"missing required key '{key}' in '{Path}': expected {what}", key, Location);
        }
        string text = Scalar(node, key, what);
        if (oneOf is not null && !oneOf.Contains(text)) throw Error(node, $"'{Path}.{key}' = '{text}' is not known: expected {what}", key);
        return text;
    }

    /// <summary>A nested mapping, or null when absent.</summary>
    public YamlMap? Map(string key, IReadOnlyCollection<string> allowed) =>
        _entries.TryGetValue(key, out var e) ? new YamlMap(e.Value, File, $"{Path}.{key}", allowed) : null;

    /// <summary>A sequence, or null when absent.</summary>
    public YamlSequenceNode? Sequence(string key)
    {
        if (!_entries.TryGetValue(key, out var e)) return null;
        if (e.Value is YamlSequenceNode seq) return seq;
        throw Error(e.Value, $"'{Path}.{key}' must be a list", key);
    }

    /// <summary>The scalar text of a node; error if it is not a scalar.</summary>
    public string Scalar(YamlNode node, string? key = null, string? expected = null)
    {
        if (node is YamlScalarNode s && s.Value is not null) return s.Value;
        throw Error(node, $"'{Path}{(key is null ? "" : "." + key)}' must be a single value{(expected is null ? "" : $": expected {expected}")}", key);
    }

    /// <summary>Parses a scalar node as a finite number.</summary>
    public double ParseNumber(YamlNode node, string key, string expected)
    {
        string text = Scalar(node, key, expected);
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
        {
            throw Error(node, $"'{Path}.{key}' = '{text}' is not a number: expected {expected}", key);
        }
        return v;
    }

    private static string DescribeRange(double min, double max, bool exclusiveMin, bool whole = false)
    {
        string kind = whole ? "a whole number" : "a number";
        bool hasMin = !double.IsNegativeInfinity(min) && min != int.MinValue, hasMax = !double.IsPositiveInfinity(max) && max != int.MaxValue;
        if (hasMin && hasMax) return $"{kind} from {min.ToString(CultureInfo.InvariantCulture)} to {max.ToString(CultureInfo.InvariantCulture)}";
        if (hasMin) return $"{kind} {(exclusiveMin ? "greater than" : "of at least")} {min.ToString(CultureInfo.InvariantCulture)}";
        if (hasMax) return $"{kind} of at most {max.ToString(CultureInfo.InvariantCulture)}";
        return kind;
    }

    private static string Scalar(YamlNode node) => node is YamlScalarNode s ? s.Value ?? "" : node.ToString();
}
