using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Tests.Cli;
using MpptArena.Trackers;

namespace MpptArena.Tests.Isolation;

/// <summary>Trackers in any language: an executable that speaks the tracker host protocol on its standard streams.</summary>
public class ProcessTrackerTests
{
    [Fact]
    public void ThePythonExampleTracksLikeTheBuiltInPerturbAndObserve()
    {
        // The example is the same algorithm as the built-in (fixed step, reverse on a power drop); they start
        // in opposite directions, so they agree closely rather than exactly.
        string file = Path.Combine(RepoRoot.Path, "examples", "python-perturb-observe", "scenario.yaml");
        var scenario = ScenarioLoader.Load(file, TrackerRegistry.WithBuiltIns());
        var result = new ScenarioRunner().Run(scenario with { Simulation = scenario.Simulation with { DurationS = 4 } });
        var py = result.Trackers.Single(t => t.Name == "py-po");
        var po = result.Trackers.Single(t => t.Name == "po");
        Assert.Null(py.Failure);
        Assert.Equal(400, py.TrackerCalls);
        Assert.Equal(po.Scores!.TrackingEfficiency, py.Scores!.TrackingEfficiency, 1e-3);
        Assert.Equal(["start_fraction", "step_v"], scenario.Trackers.Single(t => t.Name == "py-po").Descriptor.Parameters.Select(p => p.Name).Order());
    }

    [Fact]
    public void AProcessThatPrintsToItsStandardOutputBreaksTheProtocolAndIsNamed()
    {
        string dir = CliProcess.TempFolder();
        string example = File.ReadAllText(Path.Combine(RepoRoot.Path, "examples", "python-perturb-observe", "po.py"));
        File.WriteAllText(Path.Combine(dir, "chatty.py"), example.Replace(
            "            send(COMMAND, struct.pack(\"<Id\", sequence, command))",
            "            if time_s > 0.5:\n                print(\"debug: power\", voltage_v * current_a, flush=True)\n            send(COMMAND, struct.pack(\"<Id\", sequence, command))"));
        string yaml = TestScenarios.Yaml(trackers: "- { name: py, type: process, command: [python3, chatty.py], period_ms: 20 }\n- { name: po, type: perturb_observe, period_ms: 20 }");
        string file = Path.Combine(dir, "s.yaml");
        File.WriteAllText(file, yaml);
        var result = new ScenarioRunner().Run(ScenarioLoader.Load(file, TrackerRegistry.WithBuiltIns()));
        var py = result.Trackers.Single(t => t.Name == "py");
        Assert.Contains("broke the tracker host protocol", py.Failure!.Reason);
        Assert.Contains("during step at t = 0.52 s", py.Failure.Reason);
        Assert.Null(result.Trackers.Single(t => t.Name == "po").Failure);
    }

    [Fact]
    public void ACommandThatCannotStartIsRefusedAtItsLine()
    {
        string yaml = TestScenarios.Yaml(trackers: "- { name: py, type: process, command: [no-such-program-anywhere], period_ms: 20 }");
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(yaml));
        Assert.Contains("could not be started", e.Message);
        Assert.NotNull(e.Location);
    }

    [Fact]
    public void IsolationOnABuiltInIsRefusedWithTheReason()
    {
        string yaml = TestScenarios.Yaml(trackers: "- { name: po, type: perturb_observe, isolation: process }");
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(yaml));
        Assert.Contains("built in", e.Message);
        Assert.True(e.Location!.Line > 1);
    }
}
