using System.IO.Compression;

namespace MpptArena.Tests.Plugins;

/// <summary>
/// The newcomer's path end to end: pack the tool and the library, install the tool into a tool path of its
/// own, scaffold a tracker in a folder outside the checkout, build it against the MpptArena package and
/// score it with the installed command, all from that folder.
/// </summary>
public class ToolInstallTests
{
    [Fact]
    public void ThePackedToolInstallsScaffoldsBuildsAndScoresATrackerOutsideTheCheckout()
    {
        string root = Path.Combine(Path.GetTempPath(), "mppt-arena-tool-" + Guid.NewGuid().ToString("N")[..8]);
        string feed = Path.Combine(root, "feed"), tools = Path.Combine(root, "tools"), work = Path.Combine(root, "work");
        Directory.CreateDirectory(work);
        try
        {
            // Both packages, as a release would make them (Release is what the test run has just built).
            foreach (string packed in new[] { "src/MpptArena/MpptArena.csproj", "src/MpptArena.Cli/MpptArena.Cli.csproj" })
            {
                var pack = Run(RepoRoot.Path, "dotnet", "pack", Path.Combine(RepoRoot.Path, packed), "-c", "Release", "--no-build", "-o", feed, "--nologo");
                Assert.True(pack.Exit == 0, pack.Output);
            }
            string version = ArenaVersion.Release;
            using (var library = ZipFile.OpenRead(Path.Combine(feed, $"MpptArena.{version}.nupkg")))
            {
                var names = library.Entries.Select(e => e.FullName).ToList();
                Assert.Contains("lib/net10.0/MpptArena.dll", names);
                Assert.Contains("lib/net10.0/MpptArena.xml", names); // XML docs for the IDE
                Assert.Contains("content/include/mppt_arena_tracker.h", names); // the C contract
            }

            var install = Run(root, "dotnet", "tool", "install", "--tool-path", tools, "--add-source", feed, "mppt-arena", "--version", version);
            Assert.True(install.Exit == 0, install.Output);
            string tool = Path.Combine(tools, OperatingSystem.IsWindows() ? "mppt-arena.exe" : "mppt-arena");

            var help = Run(work, tool, "run", "--help");
            Assert.True(help.Exit == 0, help.Output);
            var made = Run(work, tool, "new-tracker", "far-hill");
            Assert.True(made.Exit == 0, made.Output);
            string project = Path.Combine(work, "far-hill");
            string csproj = File.ReadAllText(Path.Combine(project, "src", "FarHill.csproj"));
            Assert.Contains($"<PackageReference Include=\"MpptArena\" Version=\"{version}\" />", csproj);
            Assert.DoesNotContain(RepoRoot.Path, csproj + File.ReadAllText(Path.Combine(project, "nuget.config")));

            var build = Run(project, "dotnet", "build", "src", "-c", "Release", "--nologo");
            Assert.True(build.Exit == 0, build.Output);
            var run = Run(project, tool, "run", "scenario.yaml", "--out", "scored", "--no-plots");
            Assert.True(run.Exit == 0, run.Output);
            var summary = MpptArena.Reports.Summary.SummaryJson.Read(Path.Combine(project, "scored"));
            Assert.Equal("far_hill", summary.Trackers[0].Kind);
            Assert.True(summary.Trackers[0].Scores["tracking_efficiency"] > 0.95);
        }
        finally
        {
            try { Directory.Delete(root, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }

    private static (int Exit, string Output) Run(string workingDirectory, string file, params string[] args) =>
        CCompiler.RunIn(workingDirectory, file, args);
}
