using System.Collections.Concurrent;
using System.Diagnostics;
using System.Text.RegularExpressions;
using MpptArena.Tests.Cli;
using Xunit.Abstractions;

namespace MpptArena.Tests.Corpus;

/// <summary>
/// The malformed-input corpus (tests/corpus, written by tests/corpus/generate.py from valid base files):
/// every case must be refused the way bad input is refused (rules of the tool itself): exit 2, the file,
/// line and column or the offending option named, no stack trace, nothing left behind, within a time limit.
/// Every case runs through the command dispatcher in this process (the same code from arguments to exit
/// code as the program's Main); a fixed sample, and every structural and option case, also runs as a
/// separate mppt-arena process.
/// </summary>
public partial class CorpusTests(ITestOutputHelper output)
{
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(30);

    private static string Corpus => Path.Combine(RepoRoot.Path, "tests", "corpus");

    private static List<string> Cases() => Directory.GetDirectories(Path.Combine(Corpus, "cases")).Order(StringComparer.Ordinal).ToList();

    [Fact]
    public void EveryMalformedInputIsRefusedWithItsPositionAndNothingLeftBehind()
    {
        var cases = Cases();
        Assert.True(cases.Count > 300, $"the corpus holds only {cases.Count} cases; regenerate it with tests/corpus/generate.py");
        Check(cases, inProcess: true, "in process");
    }

    [Fact]
    public void ASampleOfTheCorpusIsRefusedTheSameByTheProgramItself()
    {
        var cases = Cases();
        var sample = cases.Where((c, k) => k % 20 == 0 || Path.GetFileName(c).StartsWith("structure-", StringComparison.Ordinal)
            || Path.GetFileName(c).StartsWith("option-", StringComparison.Ordinal) || Path.GetFileName(c).StartsWith("csv-", StringComparison.Ordinal)).ToList();
        Check(sample, inProcess: false, "as mppt-arena processes");
    }

    private void Check(List<string> cases, bool inProcess, string how)
    {
        string baseFolder = Path.Combine(Corpus, "base");
        var baseBefore = Snapshot(baseFolder);
        var failures = new ConcurrentBag<string>();
        Parallel.ForEach(cases, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(2, System.Environment.ProcessorCount) }, folder =>
        {
            string? problem = RunCase(folder, baseFolder, inProcess);
            if (problem is not null) failures.Add($"{Path.GetFileName(folder)}: {problem}");
        });
        Assert.Equal(baseBefore, Snapshot(baseFolder));
        output.WriteLine($"{cases.Count} corpus cases {how}, {cases.Count - failures.Count} refused as required");
        Assert.True(failures.IsEmpty, $"{failures.Count} of {cases.Count} corpus cases ({how}) were not refused as required:\n" + string.Join("\n", failures.Order(StringComparer.Ordinal)));
    }

    private static (int Exit, string Err) InProcess(string work, string[] args)
    {
        // Arguments that name a file of the case are made absolute: the process's current folder is shared.
        args = args.Select(a => a.Length > 0 && !a.StartsWith('-') && File.Exists(Path.Combine(work, a)) ? Path.Combine(work, a) : a).ToArray();
        var (stdout, stderr) = (new StringWriter(), new StringWriter());
        using (MpptArena.Cli.Terminal.StandardOutput.RedirectTo(stdout, stderr))
        {
            return (MpptArena.Cli.Program.Dispatch(args), stderr.ToString());
        }
    }

    private static string? RunCase(string folder, string baseFolder, bool inProcess)
    {
        var spec = File.ReadAllLines(Path.Combine(folder, "case.txt")).Select(l => l.Split(": ", 2)).ToDictionary(p => p[0], p => p[1]);
        string work = CliProcess.TempFolder();
        foreach (string f in Directory.GetFiles(folder).Where(f => Path.GetFileName(f) != "case.txt"))
        {
            // Cases name the shared valid files as {base}/...; binary cases are copied as they are.
            byte[] bytes = File.ReadAllBytes(f);
            string target = Path.Combine(work, Path.GetFileName(f));
            if (bytes.Contains((byte)0)) File.WriteAllBytes(target, bytes);
            else File.WriteAllText(target, File.ReadAllText(f).Replace("{base}", baseFolder));
        }
        var before = Snapshot(work);
        var args = Split(spec["command"]).Select(a => a.Replace("{out}", Path.Combine(work, "out")).Replace("{base}", baseFolder)).ToArray();
        var clock = Stopwatch.StartNew();
        var (exit, err) = inProcess ? InProcess(work, args) : Run(work, args);
        clock.Stop();
        if (clock.Elapsed > Limit) return $"took {clock.Elapsed.TotalSeconds:0.0} s";
        if (exit != 2) return $"exit {exit}, not 2: {Tail(err)}";
        if (err.Contains("   at ", StringComparison.Ordinal) || err.Contains("internal error", StringComparison.Ordinal)) return "stack trace or internal error: " + Tail(err);
        if (InternalName().Match(err) is { Success: true } name) return $"the message shows an internal name '{name.Value}': {Tail(err)}";
        string expect = spec["expect"];
        if (expect.StartsWith("arg:", StringComparison.Ordinal))
        {
            if (!err.Contains(expect[4..], StringComparison.Ordinal)) return $"the message does not name '{expect[4..]}': {Tail(err)}";
        }
        else
        {
            string files = string.Join("|", expect.Split('|').Select(Regex.Escape));
            if (!Regex.IsMatch(err, $@"(^|[/\\\s])({files}):\d+:\d+: ")) return $"no {expect}:line:column: {Tail(err)}";
        }
        if (!Snapshot(work).SequenceEqual(before)) return "left files behind: " + string.Join(", ", Snapshot(work).Except(before));
        Directory.Delete(work, true);
        return null;
    }

    private static (int Exit, string Err) Run(string work, string[] args)
    {
        var (exit, _, err) = CliProcess.Run(work, args);
        return (exit, err);
    }

    private static List<string> Snapshot(string folder) =>
        Directory.EnumerateFileSystemEntries(folder, "*", SearchOption.AllDirectories).Select(e => Path.GetRelativePath(folder, e)).Order(StringComparer.Ordinal).ToList();

    private static string Tail(string text) => text.Length > 300 ? text[..300] + "..." : text.Trim();

    private static IEnumerable<string> Split(string command) =>
        ArgumentPattern().Matches(command).Select(m => m.Value == "\"\"" ? "" : m.Value);

    [GeneratedRegex(@"\bSystem\.[A-Z]\w+|`1|\bMpptArena\.[A-Z]\w*\.[A-Z]|\b(VoltageReference|DutyCycle|IdealSource)\b")]
    private static partial Regex InternalName();

    [GeneratedRegex("\"\"|[^ ]+")]
    private static partial Regex ArgumentPattern();
}
