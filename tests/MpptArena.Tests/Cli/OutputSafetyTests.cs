namespace MpptArena.Tests.Cli;

/// <summary>
/// The arena never deletes or overwrites what it did not write: a folder is replaced only when it carries
/// the arena's mark and --force is given; results appear whole or not at all. (Rules of the tool itself:
/// each check fails if a user file is lost or a half-written result is left.)
/// </summary>
public class OutputSafetyTests
{
    private static string Scenario(string dir)
    {
        string file = Path.Combine(dir, "short.yaml");
        File.WriteAllText(file, TestScenarios.Yaml(
            trackers: "- { name: po, type: perturb_observe, period_ms: 10 }",
            simulation: "duration_s: 0.5\n  plant_step_us: 100"));
        return file;
    }

    private static void AssertNoStagingLeft(string folder) =>
        Assert.DoesNotContain(Directory.GetDirectories(folder, ".*", SearchOption.AllDirectories), d => d.Contains(".staging-") || d.Contains(".replaced-"));

    [Fact]
    public void AFolderWithUserFilesIsRefusedEvenWithForce()
    {
        string dir = CliProcess.TempFolder();
        string scenario = Scenario(dir);
        Directory.CreateDirectory(Path.Combine(dir, "mine"));
        File.WriteAllText(Path.Combine(dir, "mine", "notes.txt"), "keep me");
        foreach (var extra in new[] { Array.Empty<string>(), ["--force"] })
        {
            var (exit, _, err) = CliProcess.Run(dir, ["run", scenario, "--out", "mine", "--no-plots", .. extra]);
            Assert.Equal(2, exit);
            Assert.Contains("files the arena did not write", err);
            Assert.Equal("keep me", File.ReadAllText(Path.Combine(dir, "mine", "notes.txt")));
            Assert.Single(Directory.GetFileSystemEntries(Path.Combine(dir, "mine")));
        }
        AssertNoStagingLeft(dir);
    }

    [Fact]
    public void TheCurrentFolderItsParentsAndAResultsFolderWithAReadmeAreRefused()
    {
        string dir = CliProcess.TempFolder();
        string scenario = Scenario(dir);
        string work = Path.Combine(dir, "checkout");
        Directory.CreateDirectory(Path.Combine(work, ".git"));
        File.WriteAllText(Path.Combine(work, ".git", "HEAD"), "ref: refs/heads/main\n");
        Directory.CreateDirectory(Path.Combine(work, "results"));
        File.WriteAllText(Path.Combine(work, "results", "README.md"), "results land here\n");
        foreach (string target in new[] { ".", "..", work, "results" })
        {
            var (exit, _, err) = CliProcess.Run(work, "run", scenario, "--out", target, "--no-plots", "--force");
            Assert.True(exit == 2, $"--out {target}: exit {exit}: {err}");
            Assert.DoesNotContain("   at ", err);
        }
        Assert.True(File.Exists(Path.Combine(work, ".git", "HEAD")));
        Assert.True(File.Exists(Path.Combine(work, "results", "README.md")));
        Assert.True(File.Exists(scenario));
        AssertNoStagingLeft(dir);
    }

    [Fact]
    public void AnEarlierResultIsReplacedOnlyWithForceAndOnlyWhenItHoldsNothingElse()
    {
        string dir = CliProcess.TempFolder();
        string scenario = Scenario(dir);
        Assert.Equal(0, CliProcess.Run(dir, "run", scenario, "--out", "r", "--no-plots").Exit);
        Assert.True(File.Exists(Path.Combine(dir, "r", "mppt-arena-output.json")));
        var again = CliProcess.Run(dir, "run", scenario, "--out", "r", "--no-plots");
        Assert.Equal(2, again.Exit);
        Assert.Contains("--force", again.Err);
        var forced = CliProcess.Run(dir, "run", scenario, "--out", "r", "--no-plots", "--force");
        Assert.True(forced.Exit == 0, forced.Err);
        Assert.True(File.Exists(Path.Combine(dir, "r", "summary.json")));

        File.WriteAllText(Path.Combine(dir, "r", "my-analysis.txt"), "mine");
        var mixed = CliProcess.Run(dir, "run", scenario, "--out", "r", "--no-plots", "--force");
        Assert.Equal(2, mixed.Exit);
        Assert.Contains("my-analysis.txt", mixed.Err);
        Assert.Equal("mine", File.ReadAllText(Path.Combine(dir, "r", "my-analysis.txt")));
        AssertNoStagingLeft(dir);
    }

    [Fact]
    public void EmptyNamesFilesAndAJUnitFolderAreRefusedBeforeTheRun()
    {
        string dir = CliProcess.TempFolder();
        string scenario = Scenario(dir);
        File.WriteAllText(Path.Combine(dir, "a-file"), "data");
        Directory.CreateDirectory(Path.Combine(dir, "reports"));
        File.WriteAllText(Path.Combine(dir, "notes.xml"), "<notes/>");
        var cases = new[]
        {
            (new[] { "--out", "" }, "--out needs a folder name"),
            (["--out", "a-file"], "is a file"),
            (["--out", "x", "--junit", "reports"], "is a folder"),
            (["--out", "x", "--junit", "notes.xml"], "not a JUnit report"),
            (["--out", "x", "--junit", ""], "--junit needs a file name"),
            (["--out", "x", "--fail-below", "tracking_efficiency=nan"], "not a finite number"),
            (["--out", "x", "--fail-below", "nope:tracking_efficiency=0.9"], "tracker 'nope'"),
            (["--out", "x", "--fail-below", "window:nope=0.9"], "no window 'nope'"),
        };
        foreach (var (options, message) in cases)
        {
            var (exit, _, err) = CliProcess.Run(dir, ["run", scenario, "--no-plots", .. options]);
            Assert.True(exit == 2, $"{string.Join(' ', options)}: exit {exit}: {err}");
            Assert.Contains(message, err);
            Assert.False(Directory.Exists(Path.Combine(dir, "x")), string.Join(' ', options));
        }
        Assert.Equal("data", File.ReadAllText(Path.Combine(dir, "a-file")));
        Assert.Equal("<notes/>", File.ReadAllText(Path.Combine(dir, "notes.xml")));
        AssertNoStagingLeft(dir);
    }

    [Fact]
    public async Task ConcurrentRunsEachEndWithTheirOwnWholeResultOrAClearRefusal()
    {
        string dir = CliProcess.TempFolder();
        string scenario = Scenario(dir);
        // Default names: three runs in the same second get three folders.
        var defaults = Enumerable.Range(0, 3).Select(_ => Task.Run(() => CliProcess.Run(dir, "run", scenario, "--no-plots"))).ToArray();
        await Task.WhenAll(defaults);
        Assert.All(defaults, t => Assert.True(t.Result.Exit == 0, t.Result.Err));
        var folders = Directory.GetDirectories(Path.Combine(dir, "results"));
        Assert.Equal(3, folders.Length);
        Assert.All(folders, f => Assert.True(File.Exists(Path.Combine(f, "summary.json"))));

        // One --out for three concurrent runs: one writes it, the others are refused with exit 2.
        var same = Enumerable.Range(0, 3).Select(_ => Task.Run(() => CliProcess.Run(dir, "run", scenario, "--no-plots", "--out", "shared"))).ToArray();
        await Task.WhenAll(same);
        Assert.All(same, t => Assert.True(t.Result.Exit is 0 or 2, $"exit {t.Result.Exit}: {t.Result.Err}"));
        Assert.Contains(same, t => t.Result.Exit == 0);
        Assert.True(File.Exists(Path.Combine(dir, "shared", "summary.json")));

        // With --force each replaces the last; every one ends 0 or with a clear refusal, and the folder is whole.
        var forced = Enumerable.Range(0, 3).Select(_ => Task.Run(() => CliProcess.Run(dir, "run", scenario, "--no-plots", "--out", "shared", "--force"))).ToArray();
        await Task.WhenAll(forced);
        Assert.All(forced, t => Assert.True(t.Result.Exit is 0 or 2, $"exit {t.Result.Exit}: {t.Result.Err}"));
        Assert.True(File.Exists(Path.Combine(dir, "shared", "summary.json")));
        Assert.True(File.Exists(Path.Combine(dir, "shared", "mppt-arena-output.json")));
        AssertNoStagingLeft(dir);
    }
}
