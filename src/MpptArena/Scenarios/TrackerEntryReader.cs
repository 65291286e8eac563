using MpptArena.Trackers;
using MpptArena.Trackers.Isolation;
using MpptArena.Trackers.Native;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// Reads what a tracker entry of a scenario or sweep says about the tracker's code: its type, a C library
/// or a command, where it runs (isolation) and its limits.
/// </summary>
internal static class TrackerEntryReader
{
    /// <summary>The keys this reader owns in a tracker entry.</summary>
    public static readonly string[] Keys = ["type", "library", "command", "isolation", "limits"];

    private static readonly string[] IsolationValues = ["process", "in_process"];
    private static readonly string[] LimitKeys = ["call_ms", "run_s", "memory_mib"];

    /// <summary>The kind and limits of the entry <paramref name="t"/>; relative paths are taken from <paramref name="baseDirectory"/>.</summary>
    public static (TrackerDescriptor Descriptor, TrackerLimits Limits) Read(YamlMap t, string baseDirectory, TrackerRegistry registry)
    {
        string kind = t.Text("type");
        if (kind != "native" && t.Has("library")) throw t.Error(t.Node("library")!, "'library' goes with 'type: native' (a C tracker in a shared library)", "library");
        if (kind != "process" && t.Has("command")) throw t.Error(t.Node("command")!, "'command' goes with 'type: process' (an executable that speaks the tracker host protocol)", "command");
        IsolationMode? isolation = t.Has("isolation")
            ? t.Text("isolation", oneOf: IsolationValues) == "process" ? IsolationMode.Process : IsolationMode.InProcess
            : null;
        var limits = ReadLimits(t);
        TrackerDescriptor descriptor;
        try
        {
            descriptor = kind switch
            {
                "native" => Native(t, baseDirectory, isolation ?? IsolationMode.Process),
                "process" => Command(t, baseDirectory, isolation),
                _ => Registered(t, kind, registry, isolation),
            };
        }
        catch (TrackerFault fault)
        {
            var node = t.Node("library") ?? t.Node("command") ?? t.Node("type")!;
            throw t.Error(node, $"the tracker could not be started to read its parameters: {fault.Reason}{(fault.Details.Length > 0 ? $"; it wrote: {fault.Details.Split('\n')[^1]}" : "")}", "type");
        }
        return (descriptor with { CodeDigest = CodeDigestOf(descriptor, t, baseDirectory) }, limits);
    }

    /// <summary>A C library's or plug-in's bytes; for a command, its words and the bytes of every file they name.</summary>
    private static string? CodeDigestOf(TrackerDescriptor d, YamlMap t, string baseDirectory)
    {
        if (d.Origin is TrackerOrigin.Native or TrackerOrigin.Plugin && d.OriginPath is { } path && File.Exists(path)) return ContentDigest.OfFile(path);
        if (d.Origin != TrackerOrigin.Command) return null;
        var words = ((YamlSequenceNode)t.Node("command")!).Children.Select(c => ((YamlScalarNode)c).Value ?? "").ToList();
        var parts = words.Select(w => "word " + w).ToList();
        foreach (string w in words)
        {
            string full = Path.IsPathRooted(w) ? w : Path.Combine(baseDirectory, w);
            if (w.Length > 0 && File.Exists(full)) parts.Add($"file {w} {ContentDigest.OfFile(full)}");
        }
        return ContentDigest.OfParts(parts);
    }

    /// <summary>A tracker's name (default: its type): letters, digits, '-', '_' and '.', not starting with '.', at most <see cref="FileSafeName.MaxLength"/> characters, since it names files (series-NAME.csv, logs/NAME.log).</summary>
    public static string ReadName(YamlMap t, string kind)
    {
        string name = t.Text("name", kind);
        var node = t.Node("name") ?? t.Node("type")!;
        if (!FileSafeName.IsValid(name, dots: true))
        {
            throw t.Error(node, $"tracker name '{FileSafeName.Shown(name)}' must be 1 to {FileSafeName.MaxLength} letters, digits, '-', '_' or '.', not starting with '.' (it names the tracker's files in the results folder)", "name");
        }
        return name;
    }

    /// <summary>
    /// Refuses, with the entry's position, a tracker whose command the converter does not take (a duty cycle on
    /// the ideal source). The command kind is what an isolated tracker declared when its host started, or that of
    /// a built-in instance; a user's in-process code is checked when the run creates it.
    /// </summary>
    public static void CheckCommandKind(YamlMap t, TrackerDescriptor d, TrackerSettings settings, Plant.ConverterSettings converter, string? scenarioName = null)
    {
        var kind = d.DeclaredCommandKind;
        if (kind is null && d.Origin == TrackerOrigin.BuiltIn)
        {
            var probe = d.Create(settings);
            kind = probe.CommandKind;
            (probe as IDisposable)?.Dispose();
        }
        if (kind is not { } k || Runs.ScenarioRunner.CreateFrontEnd(converter).Accepts(k)) return;
        string of = scenarioName is null ? "the scenario's" : $"scenario '{scenarioName}''s";
        throw t.Error(t.Node("type")!, $"'{t.Text("type")}' commands {Describe(k)}, but {of} {ConverterName(converter.Kind)} converter takes only {Describe(Trackers.TrackerCommandKind.VoltageReference)}: use 'converter: {{ type: boost }}' or 'buck' for a duty-cycle tracker", "type");
    }

    /// <summary>A command kind in words.</summary>
    public static string Describe(TrackerCommandKind kind) => kind == TrackerCommandKind.DutyCycle ? "a duty cycle" : "a PV voltage reference";

    /// <summary>A converter kind as the scenario file spells it.</summary>
    public static string ConverterName(Plant.FrontEndKind kind) => kind switch
    {
        Plant.FrontEndKind.IdealSource => "ideal_source",
        Plant.FrontEndKind.Boost => "boost",
        _ => "buck",
    };

    private static TrackerDescriptor Native(YamlMap t, string baseDirectory, IsolationMode isolation)
    {
        var node = t.Required("library", "the path of a C tracker library (.so, .dylib, .dll)");
        string rel = t.Text("library");
        string full = Path.GetFullPath(Path.IsPathRooted(rel) ? rel : Path.Combine(baseDirectory, rel));
        if (!File.Exists(full)) throw t.Error(node, $"native tracker library '{rel}' not found (looked at {full})", "library");
        if (isolation == IsolationMode.InProcess)
        {
            try
            {
                return NativeTrackerLibrary.Load(full).Descriptor;
            }
            catch (ArenaInputException ex)
            {
                throw new ArenaInputException(ex.Reason, "library", t.Where(node));
            }
        }
        return IsolatedTrackers.Describe("native", TrackerHostLaunch.ForNativeLibrary(full), full, TrackerOrigin.Native, full);
    }

    private static TrackerDescriptor Command(YamlMap t, string baseDirectory, IsolationMode? isolation)
    {
        var node = t.Required("command", "a list: the executable and its arguments, e.g. [python3, po.py]");
        if (isolation == IsolationMode.InProcess) throw t.Error(t.Node("isolation")!, "a 'type: process' tracker always runs in a process of its own; drop 'isolation'", "isolation");
        if (node is not YamlSequenceNode seq || seq.Children.Count == 0)
        {
            throw t.Error(node, "'command' must be a non-empty list: the executable and its arguments, e.g. [python3, po.py]", "command");
        }
        var command = seq.Children.Select(c => t.Scalar(c, "command", "a text value")).ToList();
        string workDir = Path.GetFullPath(baseDirectory);
        var launch = TrackerHostLaunch.ForCommand(command, workDir);
        return IsolatedTrackers.Describe("process", launch, string.Join(' ', command), TrackerOrigin.Command, null);
    }

    private static TrackerDescriptor Registered(YamlMap t, string kind, TrackerRegistry registry, IsolationMode? isolation)
    {
        var d = registry.Find(kind) ?? throw t.Error(t.Node("type")!,
            $"unknown tracker type '{kind}'; known types: native (with 'library'), process (with 'command'), {string.Join(", ", registry.All.Select(x => x.Kind))}", "type");
        if (d.Origin == TrackerOrigin.BuiltIn)
        {
            if (isolation is not null) throw t.Error(t.Node("isolation")!, $"'{kind}' is built in and runs inside the arena; 'isolation' is for C libraries, plug-ins and commands", "isolation");
            return d;
        }
        if (isolation == IsolationMode.InProcess) return d with { Isolation = IsolationMode.InProcess };
        return IsolatedTrackers.Describe(kind, TrackerHostLaunch.ForPlugin(d.OriginPath!, kind), d.Source, TrackerOrigin.Plugin, d.OriginPath, d.Summary);
    }

    private static TrackerLimits ReadLimits(YamlMap t)
    {
        var m = t.Map("limits", LimitKeys);
        var d = TrackerLimits.Default;
        if (m is null) return d;
        return new TrackerLimits(
            m.Number("call_ms", d.CallS * 1e3, 1, 3_600_000) * 1e-3,
            m.Number("run_s", d.RunS, 0.001, 1e7),
            (long)(m.Number("memory_mib", d.MemoryMiB, 64, 1 << 20) * 1048576));
    }
}
