using System.Diagnostics;
using System.Text.Json;
using MpptArena.Tests.Cli;
using MpptArena.Tests.Plugins;

namespace MpptArena.Tests.Isolation;

/// <summary>What a CI job sees of a failing tracker: a non-zero exit code, a complete result that names the failure, the tracker's own output in its log.</summary>
public class IsolationCliTests
{
    [Fact]
    public void ACrashingCTrackerEndsTheRunWithExitOneAndAResultThatNamesIt()
    {
        string dir = CliProcess.TempFolder();
        string lib = FaultyLibraries.Build("cli_segv", "printf(\"about to crash\\n\"); fflush(stdout); *(volatile int*)0 = 1;");
        File.WriteAllText(Path.Combine(dir, "s.yaml"), TestScenarios.Yaml(trackers: $"- {{ name: fw, type: native, library: '{lib}', period_ms: 20 }}\n- {{ name: po, type: perturb_observe, period_ms: 20 }}"));
        var (exit, stdout, stderr) = CliProcess.Run(dir, "run", "s.yaml", "--out", "out", "--no-plots");
        Assert.Equal(1, exit);
        Assert.DoesNotContain("about to crash", stdout);
        Assert.Contains("killed by SIGSEGV during step at t = 0.52 s, call 26", stderr + stdout);
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "out", "summary.json")));
        var fw = summary.RootElement.GetProperty("trackers").EnumerateArray().Single(t => t.GetProperty("name").GetString() == "fw");
        Assert.True(fw.GetProperty("failed").GetBoolean());
        Assert.Equal(8, fw.GetProperty("failure_recent_calls").GetArrayLength());
        Assert.Contains("about to crash", File.ReadAllText(Path.Combine(dir, "out", "logs", "fw.log")));
        Assert.Empty(Directory.GetDirectories(dir, ".out.staging-*")); // no half-written result left beside it
    }

    [Fact]
    public void APluginThatReplacesConsoleOutCannotHideTheRankingTable()
    {
        string dir = CliProcess.TempFolder();
        File.WriteAllText(Path.Combine(dir, "s.yaml"), TestScenarios.Yaml(trackers:
            "- { name: cs, type: sample_faulty, period_ms: 20, isolation: in_process, parameters: { fault: 7 } }\n- { name: po, type: perturb_observe, period_ms: 20 }")
            + $"\nplugins: [ '{PluginTests.SamplePlugin}' ]\n");
        var (exit, stdout, _) = CliProcess.Run(dir, "run", "s.yaml", "--out", "out", "--no-plots");
        Assert.Equal(0, exit);
        Assert.Contains("results: out", stdout);
        Assert.Contains("po", stdout);
        Assert.DoesNotContain("tracker chatter", stdout);
        Assert.Contains("tracker chatter on stdout", File.ReadAllText(Path.Combine(dir, "out", "logs", "in-process.log")));
    }

    [Fact]
    public void AnInProcessEndlessLoopEndsTheRunWithExitOneInsteadOfHanging()
    {
        string dir = CliProcess.TempFolder();
        File.WriteAllText(Path.Combine(dir, "s.yaml"), TestScenarios.Yaml(trackers:
            "- { name: cs, type: sample_faulty, period_ms: 20, isolation: in_process, limits: { call_ms: 300 }, parameters: { fault: 8 } }")
            + $"\nplugins: [ '{PluginTests.SamplePlugin}' ]\n");
        var watch = Stopwatch.StartNew();
        var (exit, _, stderr) = CliProcess.Run(dir, "run", "s.yaml", "--out", "out", "--no-plots");
        Assert.Equal(1, exit);
        Assert.Contains("made no reply within 0.3 s", stderr);
        Assert.True(watch.Elapsed.TotalSeconds < 60);
        Assert.False(Directory.Exists(Path.Combine(dir, "out")));
        Assert.Empty(Directory.GetDirectories(dir, ".out.staging-*")); // no half-written result left beside it
    }

    /// <summary>
    /// True when this process ignores SIGINT (started in the background by a non-interactive shell, or under
    /// nohup): a child inherits that and cannot see SIGINT at all (POSIX: ignored signals stay ignored across exec).
    /// </summary>
    private static bool SigintIgnored()
    {
        if (!OperatingSystem.IsLinux()) return false;
        string? line = File.ReadLines("/proc/self/status").FirstOrDefault(l => l.StartsWith("SigIgn:", StringComparison.Ordinal));
        return line is not null && (Convert.ToUInt64(line[7..].Trim(), 16) & (1UL << 1)) != 0; // bit n-1 for signal n; SIGINT is 2
    }

    [Theory]
    [InlineData("INT", 130)]
    [InlineData("TERM", 143)]
    public async Task ASignalStopsTheRunRemovesItsPartialOutputAndExitsWith128PlusItsNumber(string signal, int expectedExit)
    {
        if (OperatingSystem.IsWindows()) return; // POSIX signals; the Windows console sends Ctrl+C differently.
        if (signal == "INT" && SigintIgnored()) return; // nothing can deliver SIGINT to a child here; SIGTERM still runs
        string dir = CliProcess.TempFolder();
        File.WriteAllText(Path.Combine(dir, "s.yaml"), TestScenarios.Yaml(simulation: "duration_s: 100000\n  plant_step_us: 100\n  seed: 3"));
        var psi = new ProcessStartInfo("dotnet") { WorkingDirectory = dir, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (string arg in new[] { Path.Combine(AppContext.BaseDirectory, "mppt-arena.dll"), "run", "s.yaml", "--out", "out", "--no-plots" }) psi.ArgumentList.Add(arg);
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        var deadline = Stopwatch.StartNew();
        // The run writes into a hidden staging folder beside its target until it is complete.
        bool Staging() => Directory.GetDirectories(dir, ".out.staging-*").Length > 0;
        while (!Staging() && deadline.Elapsed.TotalSeconds < 60) Thread.Sleep(50);
        Assert.True(Staging(), "the run made no staging folder");
        Thread.Sleep(300);
        Assert.Equal(0, CCompiler.Run("kill", "-" + signal, p.Id.ToString()).Exit);
        Assert.True(p.WaitForExit(30_000), $"the run did not stop after SIG{signal}");
        Assert.Equal(expectedExit, p.ExitCode);
        Assert.Contains($"interrupted by SIG{signal}", await stderr);
        await stdout;
        Assert.False(Directory.Exists(Path.Combine(dir, "out")));
        Assert.False(Staging(), "the staging folder was left behind");
    }
}
