using MpptArena.Numerics;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Trackers;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Sweeps;

/// <summary>
/// Reads a sweep file: a scenario suite (files or folders), trackers with swept parameters (a list, a
/// range with a step, or a logarithmic range), sampling, objective, heat-map axes and optional tuning.
/// Errors carry file, line and column like scenario errors.
/// </summary>
public static class SweepLoader
{
    private static readonly string[] TopKeys = ["name", "scenarios", "trackers", "plugins", "sampling", "objective", "heatmap", "tune"];

    /// <summary>Most cases a sweep may hold (a million runs is days of work on a large machine).</summary>
    public const int MaxCases = 1_000_000;

    /// <summary>Loads a sweep file.</summary>
    /// <param name="path">The YAML file.</param>
    /// <param name="registry">Tracker kinds that may be named.</param>
    /// <param name="scoreKeys">Score keys the objective and tune score may name (besides window:NAME of the scenarios' windows); null skips that check.</param>
    public static SweepDefinition Load(string path, TrackerRegistry registry, IReadOnlyCollection<string>? scoreKeys = null)
    {
        string dir = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        var rootNode = YamlInput.ReadRoot(YamlInput.ReadText(path, "sweep file"), path, "a sweep mapping");
        var root = new YamlMap(rootNode, path, "sweep", TopKeys);
        string name = root.Text("name");
        if (!FileSafeName.IsValid(name, dots: false))
        {
            throw root.Error(root.Node("name")!, $"'name' = '{FileSafeName.Shown(name)}' must be 1 to {FileSafeName.MaxLength} letters, digits, '-' and '_' (it names the results folder)", "name");
        }
        if (root.Sequence("plugins") is { } plugins)
        {
            registry = registry.Clone();
            foreach (var p in plugins.Children)
            {
                string rel = root.Scalar(p, "plugins");
                try
                {
                    TrackerPluginLoader.LoadInto(registry, Path.IsPathRooted(rel) ? rel : Path.Combine(dir, rel));
                }
                catch (ArenaInputException ex)
                {
                    throw new ArenaInputException(ex.Reason, "plugins", root.Where(p));
                }
            }
        }
        var scenarios = ReadScenarios(root, dir, registry);
        var sampling = ReadSampling(root);
        var trackers = ReadTrackers(root, dir, registry, scenarios, sampling.Method != SweepSamplingMethod.Grid);
        string objective = root.Text("objective", "tracking_efficiency");
        if (scoreKeys is not null) CheckScore(root, "objective", objective, scoreKeys, scenarios);
        string? hx = null, hy = null;
        if (root.Map("heatmap", ["x", "y"]) is { } h)
        {
            var axes = trackers.SelectMany(t => t.Axes.Select(a => a.Name)).Distinct().ToList();
            foreach (string key in new[] { "x", "y" })
            {
                string axis = h.Text(key);
                if (!axes.Contains(axis))
                {
                    throw h.Error(h.Node(key)!, $"heatmap {key} '{axis}' is not a swept axis; {(axes.Count == 0 ? "the sweep sweeps nothing" : "swept: " + string.Join(", ", axes))}", key);
                }
            }
            hx = h.Text("x");
            hy = h.Text("y");
        }
        var tune = ReadTune(root, trackers);
        if (tune is not null && scoreKeys is not null) CheckScore(root.Map("tune", ["tracker", "parameters", "score", "goal", "over", "max_evaluations"])!, "score", tune.Score, scoreKeys, scenarios);
        return new SweepDefinition(name, scenarios, trackers, sampling, objective, hx, hy, tune);
    }

    private static void CheckScore(YamlMap map, string key, string score, IReadOnlyCollection<string> scoreKeys, IReadOnlyList<Scenario> scenarios)
    {
        if (scoreKeys.Contains(score)) return;
        const string prefix = "window:";
        var windows = scenarios.SelectMany(s => s.Scoring.AllWindows.SelectMany(w => w.Group is null ? [w.Name] : new[] { w.Name, w.Group })).Distinct().ToList();
        if (score.StartsWith(prefix, StringComparison.Ordinal) && windows.Contains(score[prefix.Length..])) return;
        var node = map.Node(key) ?? throw new ArenaInputException($"'{key}' defaults to '{score}', which is not a score", key, map.Location);
        throw map.Error(node, $"'{key}' = '{score}' is not a score; known: {string.Join(", ", scoreKeys)}{string.Concat(windows.Select(w => ", " + prefix + w))}", key);
    }

    private static List<Scenario> ReadScenarios(YamlMap root, string dir, TrackerRegistry registry)
    {
        var seq = root.Sequence("scenarios") ?? throw new ArenaInputException("missing required list 'scenarios' in 'sweep': files or folders of scenarios", "scenarios", root.Location);
        var list = new List<Scenario>();
        foreach (var node in seq.Children)
        {
            string rel = root.Scalar(node, "scenarios", "a scenario file or folder");
            string full = Path.IsPathRooted(rel) ? rel : Path.Combine(dir, rel);
            IEnumerable<string> files;
            if (Directory.Exists(full)) files = Directory.GetFiles(full, "*.yaml").Order(StringComparer.Ordinal).Where(f => !IsPlantFile(f));
            else if (File.Exists(full)) files = [full];
            else throw root.Error(node, $"scenario file or folder '{rel}' not found", "scenarios");
            foreach (string f in files) list.Add(ScenarioLoader.Load(f, registry));
        }
        if (list.Count == 0) throw root.Error(seq, "'scenarios' names no scenario files", "scenarios");
        var twice = list.GroupBy(s => s.Name).FirstOrDefault(g => g.Count() > 1);
        if (twice is not null) throw root.Error(seq, $"scenario name '{twice.Key}' appears twice in the suite", "scenarios");
        return list;
    }

    private static bool IsPlantFile(string file) =>
        File.ReadLines(file).Any(l => l.StartsWith("conditions:", StringComparison.Ordinal));

    private static List<SweepTracker> ReadTrackers(YamlMap root, string dir, TrackerRegistry registry, IReadOnlyList<Scenario> scenarios, bool sampled)
    {
        var seq = root.Sequence("trackers") ?? throw new ArenaInputException("missing required list 'trackers' in 'sweep'", "trackers", root.Location);
        var list = new List<SweepTracker>();
        int index = 0;
        foreach (var item in seq.Children)
        {
            var t = new YamlMap(item, root.File, $"sweep.trackers[{index++}]", ["name", "period_ms", "parameters", .. TrackerEntryReader.Keys]);
            var (descriptor, limits) = TrackerEntryReader.Read(t, dir, registry);
            string kind = t.Text("type");
            string name = TrackerEntryReader.ReadName(t, kind);
            if (list.Any(x => x.Name == name)) throw t.Error(t.Node("name") ?? item, $"tracker name '{name}' is used twice", "name");
            var axes = new List<SweepAxis>();
            var fixedValues = new Dictionary<string, double>(StringComparer.Ordinal);
            double period = 10;
            if (t.Node("period_ms") is { } pn)
            {
                // Sample periods are always choices: a period must be a whole number of plant steps, so random and
                // Latin-hypercube sampling pick among the listed (or stepped) values instead of drawing from a range.
                var axis = ReadAxis(t, pn, "period_ms", 0.001, 3_600_000, sampled: false) with { IsChoice = true };
                if (axis.Values.Count == 1 && axis.Min == axis.Max) period = axis.Values[0];
                else axes.Add(axis);
                foreach (var sc in scenarios.Where(sc => sc.Simulation.PlantStepGiven))
                {
                    double step = sc.Simulation.PlantStepS;
                    foreach (double v in axis.Values.Where(v => !SimulationSettings.IsWholeNumberOfSteps(v * 1e-3, step)))
                    {
                        throw t.Error(pn, $"'period_ms' = {v:0.###} is not a whole number of the plant steps of scenario '{sc.Name}' ({step * 1e6:0.###} us); use multiples of it, or leave plant_step_us out of the scenario to have a step chosen per case", "period_ms");
                    }
                }
            }
            if (t.Node("parameters") is { } paramsNode)
            {
                var pm = new YamlMap(paramsNode, root.File, $"{t.Path}.parameters", descriptor.Parameters.Select(p => p.Name).ToArray());
                foreach (var p in descriptor.Parameters.Where(p => pm.Has(p.Name)))
                {
                    var axis = ReadAxis(pm, pm.Node(p.Name)!, p.Name, p.Min, p.Max, sampled);
                    if (axis.Values.Count == 1 && axis.Min == axis.Max) fixedValues[p.Name] = axis.Values[0];
                    else axes.Add(axis);
                }
            }
            double settings = sampled ? 1 : axes.Aggregate(1.0, (n, a) => n * a.Values.Count);
            if (settings * scenarios.Count > MaxCases)
            {
                throw t.Error(item, $"tracker '{name}' makes {settings * scenarios.Count:G3} cases ({settings:G3} settings x {scenarios.Count} scenarios); a sweep is limited to {MaxCases} cases: sweep fewer values or sample (sampling: {{ method: latin_hypercube, count: N }})", "parameters");
            }
            var probeSettings = new TrackerSettings(descriptor.Parameters, fixedValues);
            foreach (var sc in scenarios) TrackerEntryReader.CheckCommandKind(t, descriptor, probeSettings, sc.Converter, sc.Name);
            list.Add(new SweepTracker(name, descriptor, fixedValues, axes, period) { Limits = limits });
        }
        if (list.Count == 0) throw root.Error(seq, "'trackers' is empty", "trackers");
        return list;
    }

    /// <summary>A number, a list (choices), {from, to, step}, {from, to} when sampled (a range) or {log_from, log_to, count}.</summary>
    private static SweepAxis ReadAxis(YamlMap parent, YamlNode node, string name, double min, double max, bool sampled)
    {
        string range = $"expected values from {min} to {max}";
        double Check(YamlNode n, double v) => v >= min && v <= max ? v : throw parent.Error(n, $"'{name}' value {v} is outside its declared range: {range}", name);
        switch (node)
        {
            case YamlScalarNode:
            {
                double v = Check(node, parent.ParseNumber(node, name, "a number"));
                return new SweepAxis(name, [v], v, v, false);
            }
            case YamlSequenceNode seq:
            {
                var values = seq.Children.Select(n => Check(n, parent.ParseNumber(n, name, "a number"))).Distinct().Order().ToList();
                if (values.Count == 0) throw parent.Error(node, $"'{name}' is an empty list", name);
                return new SweepAxis(name, values, values[0], values[^1], false) { IsChoice = true };
            }
            default:
            {
                var m = new YamlMap(node, parent.File, $"{parent.Path}.{name}", ["from", "to", "step", "log_from", "log_to", "count"]);
                if (m.Has("from"))
                {
                    double from = Check(m.Node("from")!, m.Number("from")), to = Check(m.Node("to") ?? node, m.Number("to"));
                    if (to < from) throw m.Error(m.Node("to")!, "'to' must not be below 'from'", "to");
                    if (sampled && !m.Has("step")) return new SweepAxis(name, [from, to], from, to, false);
                    double step = m.Positive("step");
                    int n = (int)Math.Floor((to - from) / step + 1e-9) + 1;
                    if (n > 100_000) throw m.Error(m.Node("step")!, $"the range has {n} values; use a larger step", "step");
                    var values = Enumerable.Range(0, n).Select(k => Math.Round(from + k * step, 12)).ToList();
                    return new SweepAxis(name, values, from, to, false);
                }
                if (m.Has("log_from"))
                {
                    double from = Check(m.Node("log_from")!, m.Positive("log_from")), to = Check(m.Node("log_to") ?? node, m.Positive("log_to"));
                    int count = m.Integer("count", null, 2, 100_000);
                    if (to <= from) throw m.Error(m.Node("log_to")!, "'log_to' must be above 'log_from'", "log_to");
                    var values = Enumerable.Range(0, count).Select(k => Math.Round(from * PortableMath.Exp(PortableMath.Log(to / from) * k / (count - 1)), 12)).ToList();
                    return new SweepAxis(name, values, from, to, true);
                }
                throw m.Error(node, $"'{name}' needs a number, a list, {{from, to, step}} or {{log_from, log_to, count}}", name);
            }
        }
    }

    private static SweepSampling ReadSampling(YamlMap root)
    {
        var s = root.Map("sampling", ["method", "count", "seed"]);
        if (s is null) return new SweepSampling(SweepSamplingMethod.Grid);
        string method = s.Text("method", "grid", ["grid", "random", "latin_hypercube"]);
        var m = method switch { "random" => SweepSamplingMethod.Random, "latin_hypercube" => SweepSamplingMethod.LatinHypercube, _ => SweepSamplingMethod.Grid };
        int count = m == SweepSamplingMethod.Grid ? 0 : s.Integer("count", null, 1, MaxCases);
        string seedText = s.Has("seed") ? s.Scalar(s.Node("seed")!, "seed") : "1";
        if (!ulong.TryParse(seedText, out ulong seed)) throw s.Error(s.Node("seed")!, "'seed' must be a whole number of at least 0", "seed");
        return new SweepSampling(m, count, seed);
    }

    private static TuneSettings? ReadTune(YamlMap root, List<SweepTracker> trackers)
    {
        var t = root.Map("tune", ["tracker", "parameters", "score", "goal", "over", "max_evaluations"]);
        if (t is null) return null;
        string name = t.Text("tracker");
        var tracker = trackers.FirstOrDefault(x => x.Name == name) ?? throw t.Error(t.Node("tracker")!, $"tune names tracker '{name}', which the sweep does not have", "tracker");
        var seq = t.Sequence("parameters") ?? throw new ArenaInputException("tune needs 'parameters': the names to tune", "parameters", t.Location);
        var names = seq.Children.Select(n => t.Scalar(n, "parameters")).ToList();
        if (names.Count == 0) throw t.Error(seq, "tune 'parameters' is empty: name at least one parameter to tune", "parameters");
        foreach (var (n, node) in names.Zip(seq.Children))
        {
            if (tracker.Descriptor.Parameters.All(p => p.Name != n))
                throw t.Error(node, $"tracker '{name}' declares no parameter '{n}'; it declares: {string.Join(", ", tracker.Descriptor.Parameters.Select(p => p.Name))}", "parameters");
        }
        return new TuneSettings(name, names, t.Text("score", "tracking_efficiency"), t.Text("goal", "maximise", ["maximise", "minimise"]) == "maximise",
            t.Text("over", "mean", ["mean", "worst"]) == "worst", t.Integer("max_evaluations", 40, 3, 100_000));
    }
}
