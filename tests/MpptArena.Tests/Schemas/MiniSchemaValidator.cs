using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Tests.Schemas;

/// <summary>
/// The subset of JSON Schema 2020-12 that the project's schemas use (type, properties, required,
/// additionalProperties, patternProperties, items, enum, const, oneOf, local $ref, min/max counts and
/// bounds, pattern), enough to check documents against them in tests. Returns the first few errors.
/// </summary>
internal sealed class MiniSchemaValidator(JsonElement root)
{
    public List<string> Errors { get; } = [];

    public static MiniSchemaValidator Load(string path) => new(JsonDocument.Parse(File.ReadAllText(path)).RootElement);

    public bool Validate(object? value) => Check(root, value, "$") && Errors.Count == 0;

    /// <summary>A YAML tree as plain values: scalars become long, double, bool or string.</summary>
    public static object? FromYaml(YamlNode node) => node switch
    {
        YamlMappingNode m => m.Children.ToDictionary(kv => ((YamlScalarNode)kv.Key).Value!, kv => FromYaml(kv.Value)),
        YamlSequenceNode s => s.Children.Select(FromYaml).ToList(),
        YamlScalarNode sc when sc.Style is YamlDotNet.Core.ScalarStyle.Plain && sc.Value is "true" or "false" => sc.Value == "true",
        YamlScalarNode sc when sc.Style is YamlDotNet.Core.ScalarStyle.Plain && long.TryParse(sc.Value, NumberStyles.Integer, CultureInfo.InvariantCulture, out long l) => l,
        YamlScalarNode sc when sc.Style is YamlDotNet.Core.ScalarStyle.Plain && double.TryParse(sc.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out double d) => d,
        YamlScalarNode sc => sc.Value,
        _ => null,
    };

    /// <summary>A JSON tree as plain values.</summary>
    public static object? FromJson(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.Object => e.EnumerateObject().ToDictionary(p => p.Name, p => FromJson(p.Value)),
        JsonValueKind.Array => e.EnumerateArray().Select(FromJson).ToList(),
        JsonValueKind.Number => e.TryGetInt64(out long l) ? (object)l : e.GetDouble(),
        JsonValueKind.String => e.GetString(),
        JsonValueKind.True => true,
        JsonValueKind.False => false,
        _ => null,
    };

    private bool Fail(string path, string message)
    {
        if (Errors.Count < 10) Errors.Add($"{path}: {message}");
        return false;
    }

    private bool Check(JsonElement s, object? v, string path)
    {
        if (s.ValueKind == JsonValueKind.True) return true;
        if (s.TryGetProperty("$ref", out var r))
        {
            var target = root;
            foreach (string part in r.GetString()!.TrimStart('#', '/').Split('/')) target = target.GetProperty(part);
            if (!Check(target, v, path)) return false;
        }
        if (s.TryGetProperty("oneOf", out var one))
        {
            int ok = 0;
            foreach (var alt in one.EnumerateArray())
            {
                var probe = new MiniSchemaValidator(root);
                if (probe.Check(alt, v, path) && probe.Errors.Count == 0) ok++;
            }
            if (ok != 1) return Fail(path, $"matches {ok} of the oneOf alternatives");
        }
        if (s.TryGetProperty("type", out var t) && !TypeMatches(t, v)) return Fail(path, $"expected {t}, got {v?.GetType().Name ?? "null"}");
        if (s.TryGetProperty("const", out var c) && !Equals(FromJson(c), v)) return Fail(path, $"expected {c}");
        if (s.TryGetProperty("enum", out var en) && !en.EnumerateArray().Any(x => Equals(FromJson(x), v))) return Fail(path, $"not one of {en}");
        if (v is long or double)
        {
            double d = Convert.ToDouble(v, CultureInfo.InvariantCulture);
            if (s.TryGetProperty("minimum", out var mi) && d < mi.GetDouble()) return Fail(path, $"below minimum {mi}");
            if (s.TryGetProperty("maximum", out var ma) && d > ma.GetDouble()) return Fail(path, $"above maximum {ma}");
            if (s.TryGetProperty("exclusiveMinimum", out var em) && d <= em.GetDouble()) return Fail(path, $"not above {em}");
        }
        if (v is string str && s.TryGetProperty("pattern", out var pat) && !Regex.IsMatch(str, pat.GetString()!)) return Fail(path, $"does not match {pat}");
        if (v is Dictionary<string, object?> obj)
        {
            if (s.TryGetProperty("required", out var req))
                foreach (var k in req.EnumerateArray()) if (!obj.ContainsKey(k.GetString()!)) return Fail(path, $"missing required '{k.GetString()}'");
            if (s.TryGetProperty("minProperties", out var minP) && obj.Count < minP.GetInt32()) return Fail(path, "too few properties");
            if (s.TryGetProperty("maxProperties", out var maxP) && obj.Count > maxP.GetInt32()) return Fail(path, "too many properties");
            foreach (var (key, value) in obj)
            {
                bool known = false;
                if (s.TryGetProperty("properties", out var props) && props.TryGetProperty(key, out var ps))
                {
                    known = true;
                    Check(ps, value, $"{path}.{key}");
                }
                if (s.TryGetProperty("patternProperties", out var pp))
                {
                    foreach (var p in pp.EnumerateObject().Where(p => Regex.IsMatch(key, p.Name)))
                    {
                        known = true;
                        Check(p.Value, value, $"{path}.{key}");
                    }
                }
                if (!known && s.TryGetProperty("additionalProperties", out var ap))
                {
                    if (ap.ValueKind == JsonValueKind.False) Fail(path, $"unknown key '{key}'");
                    else Check(ap, value, $"{path}.{key}");
                }
            }
        }
        if (v is List<object?> list)
        {
            if (s.TryGetProperty("minItems", out var mn) && list.Count < mn.GetInt32()) return Fail(path, "too few items");
            if (s.TryGetProperty("maxItems", out var mx) && list.Count > mx.GetInt32()) return Fail(path, "too many items");
            if (s.TryGetProperty("items", out var items))
                for (int k = 0; k < list.Count; k++) Check(items, list[k], $"{path}[{k}]");
        }
        return Errors.Count == 0;
    }

    private static bool TypeMatches(JsonElement t, object? v)
    {
        if (t.ValueKind == JsonValueKind.Array) return t.EnumerateArray().Any(x => TypeMatches(x, v));
        return t.GetString() switch
        {
            "object" => v is Dictionary<string, object?>,
            "array" => v is List<object?>,
            "string" => v is string,
            "integer" => v is long,
            "number" => v is long or double,
            "boolean" => v is bool,
            "null" => v is null,
            _ => false,
        };
    }
}
