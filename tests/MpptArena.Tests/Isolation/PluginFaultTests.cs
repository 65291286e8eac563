using MpptArena.Runs;
using MpptArena.Tests.Plugins;

namespace MpptArena.Tests.Isolation;

/// <summary>The faults of C# tracker code, in a plug-in run isolated (the default): each is this tracker's failure alone.</summary>
public class PluginFaultTests
{
    private static (TrackerResult Faulty, TrackerResult Po, string Log) Run(int fault, string options = "")
    {
        var yaml = TestScenarios.Yaml(trackers:
                $"- {{ name: po, type: perturb_observe, period_ms: 20 }}\n- {{ name: cs, type: sample_faulty, period_ms: 20, parameters: {{ fault: {fault} }}{options} }}")
            + $"\nplugins: [ '{PluginTests.SamplePlugin}' ]\n";
        var log = new StringWriter();
        var result = new ScenarioRunner().Run(TestScenarios.Parse(yaml), logFor: s => s.Name == "cs" ? log : null);
        return (result.Trackers.Single(t => t.Name == "cs"), result.Trackers.Single(t => t.Name == "po"), log.ToString());
    }

    private static void AssertFailed(int fault, string reason, string options = "")
    {
        var (cs, po, _) = Run(fault, options);
        Assert.NotNull(cs.Failure);
        Assert.Contains(reason, cs.Failure!.Reason);
        Assert.Contains("during step at t = 0.52 s, call 26", cs.Failure.Reason);
        Assert.Null(po.Failure);
        Assert.True(po.Scores!.TrackingEfficiency > 0.95);
    }

    [Fact]
    public void AnExceptionIsNamedWithItsStackTraceInTheDetails()
    {
        var (cs, _, log) = Run(1);
        Assert.Contains("threw InvalidOperationException: duty register out of sync", cs.Failure!.Reason);
        Assert.Contains("FaultyTracker.Step", cs.Failure.Details);
        Assert.Contains("FaultyTracker.Step", log);
    }

    [Fact]
    public void EnvironmentExitIsAFailure() => AssertFailed(2, "exited with code 0");

    [Fact]
    public void FailFastIsAFailure() => AssertFailed(3, "killed by SIGABRT");

    [Fact]
    public void AnExceptionOnTheTrackersOwnThreadIsAFailure() => AssertFailed(4, "killed by SIGABRT");

    [Fact]
    public void AStackOverflowIsAFailure() => AssertFailed(5, "killed by SIG");

    [Fact]
    public void UnboundedAllocationMeetsTheHeapLimit() => AssertFailed(6, "OutOfMemoryException", ", limits: { memory_mib: 128 }");

    [Fact]
    public void AnEndlessLoopIsStoppedAtTheCallLimit() => AssertFailed(8, "no reply within 0.2 s", ", limits: { call_ms: 200 }");

    [Fact]
    public void ConsoleOutputGoesToTheLogAndReplacingConsoleOutHarmsNothing()
    {
        var (cs, _, log) = Run(7);
        Assert.Null(cs.Failure);
        Assert.Contains("tracker chatter on stdout", log);
    }

    [Fact]
    public void StaticStateIsFreshForEveryInstance()
    {
        // The plug-in shifts its reference by 5 % of Voc for every instance its statics have seen; a second
        // instance in the same run, and a later run served by a pooled host, still see a first instance.
        var yaml = TestScenarios.Yaml(trackers:
                "- { name: a, type: sample_faulty, period_ms: 20 }\n- { name: b, type: sample_faulty, period_ms: 20 }\n- { name: c, type: sample_faulty, period_ms: 20, isolation: in_process }\n- { name: d, type: sample_faulty, period_ms: 20, isolation: in_process }")
            + $"\nplugins: [ '{PluginTests.SamplePlugin}' ]\n";
        var scenario = TestScenarios.Parse(yaml);
        var first = new ScenarioRunner().Run(scenario);
        var second = new ScenarioRunner().Run(scenario with { Trackers = scenario.Trackers.Take(2).ToList() });
        double a = first.Trackers[0].Scores!.TrackingEfficiency;
        Assert.Equal(a, first.Trackers[1].Scores!.TrackingEfficiency);
        Assert.Equal(a, second.Trackers[0].Scores!.TrackingEfficiency);
        Assert.Equal(a, second.Trackers[1].Scores!.TrackingEfficiency);
        // In process the statics are the arena's: the second in-process instance inherits the first one's.
        Assert.NotEqual(first.Trackers[2].Scores!.TrackingEfficiency, first.Trackers[3].Scores!.TrackingEfficiency);
    }
}
