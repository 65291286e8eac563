using MpptArena.Arrays;
using MpptArena.Environment;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>Reads the shading list: fixed shades on chosen substrings or modules, and moving shadows along a string.</summary>
internal static class ShadingReader
{
    public static IReadOnlyList<IShading> Read(YamlSequenceNode seq, YamlMap parent, ArrayLayout layout, ProfileReader profiles)
    {
        var list = new List<IShading>();
        int index = 0;
        foreach (var item in seq.Children)
        {
            string path = $"{parent.Path}.shading[{index++}]";
            var m = new YamlMap(item, parent.File, path, ["name", "substrings", "modules", "transmittance", "moving_shadow"]);
            m.Text("name", ""); // optional; when given, a text value
            if (m.Has("moving_shadow"))
            {
                list.Add(Moving(m.Map("moving_shadow", ["string", "from_substring", "to_substring", "start_s", "end_s", "width_substrings", "transmittance"])!, layout));
                continue;
            }
            var indices = new List<int>();
            if (m.Sequence("substrings") is { } subs)
            {
                int k = 0;
                foreach (var s in subs.Children)
                {
                    var r = new YamlMap(s, parent.File, $"{path}.substrings[{k++}]", ["string", "module", "substring"]);
                    int st = Index(r, "string", layout.StringsInParallel, "strings"), mo = Index(r, "module", layout.ModulesPerString, "modules per string");
                    int su = Index(r, "substring", layout.SubstringsPerModule, "substrings per module");
                    indices.Add(layout.IndexOf(st, mo, su));
                }
            }
            if (m.Sequence("modules") is { } mods)
            {
                int k = 0;
                foreach (var s in mods.Children)
                {
                    var r = new YamlMap(s, parent.File, $"{path}.modules[{k++}]", ["string", "module"]);
                    int st = Index(r, "string", layout.StringsInParallel, "strings"), mo = Index(r, "module", layout.ModulesPerString, "modules per string");
                    for (int su = 0; su < layout.SubstringsPerModule; su++) indices.Add(layout.IndexOf(st, mo, su));
                }
            }
            if (indices.Count == 0)
            {
                throw new ArenaInputException($"'{path}' shades nothing: give 'substrings', 'modules' or 'moving_shadow'", "substrings", m.Location);
            }
            m.Required("transmittance", "a share of light from 0 to 1, or a list of segments");
            list.Add(new SubstringShade(indices.Distinct().ToList(), profiles.Read(m, "transmittance", 0, 1, false)));
        }
        return list;
    }

    private static int Index(YamlMap r, string key, int count, string what)
    {
        var node = r.Required(key, $"a {key} number from 1 to {count}");
        string text = r.Scalar(node, key);
        if (!int.TryParse(text, out int v) || v < 1 || v > count)
        {
            throw r.Error(node, $"{key} {text} does not exist: the array has {count} {what} (numbered from 1)", key);
        }
        return v - 1;
    }

    private static MovingShadow Moving(YamlMap m, ArrayLayout layout)
    {
        int st = Index(m, "string", layout.StringsInParallel, "strings");
        int n = layout.SubstringsPerString;
        double from = m.Number("from_substring", null, -1000, n + 1000), to = m.Number("to_substring", null, -1000, n + 1000);
        double start = m.Number("start_s", null, 0, ProfileReader.MaxSegmentS), end = m.Number("end_s", null, 0, ProfileReader.MaxSegmentS);
        if (end <= start) throw m.Error(m.Node("end_s")!, "'end_s' must be after 'start_s'", "end_s");
        return new MovingShadow(layout.IndexOf(st, 0, 0), n, start, end, from, to, m.Positive("width_substrings", null, 1e6), m.Number("transmittance", null, 0, 1));
    }
}
