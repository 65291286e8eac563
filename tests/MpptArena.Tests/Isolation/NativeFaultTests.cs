using MpptArena.Runs;

namespace MpptArena.Tests.Isolation;

/// <summary>
/// Each fault a firmware developer's C tracker can have, run isolated next to a healthy built-in P&amp;O: the
/// faulty one is reported failed with a reason that names what happened and when, and the built-in scores
/// exactly what it scores alone.
/// </summary>
public class NativeFaultTests
{
    private static readonly Lazy<double> AloneEfficiency = new(() =>
        TestScenarios.Run(Scenario("")).Trackers.Single().Scores!.TrackingEfficiency);

    private static string Scenario(string extraTracker) => TestScenarios.Yaml(
        trackers: "- { name: po, type: perturb_observe, period_ms: 20 }" + (extraTracker.Length > 0 ? "\n" + extraTracker : ""));

    private static TrackerResult RunFaulty(string fault, string options = "", string name = "faulty")
    {
        string lib = FaultyLibraries.Build(name, fault);
        var result = TestScenarios.Run(Scenario($"- {{ name: fw, type: native, library: '{lib}', period_ms: 20{options} }}"));
        var po = result.Trackers.Single(t => t.Name == "po");
        Assert.Null(po.Failure);
        Assert.Equal(AloneEfficiency.Value, po.Scores!.TrackingEfficiency);
        return result.Trackers.Single(t => t.Name == "fw");
    }

    private static void AssertFailedAfterHalfASecond(TrackerResult fw, string reason)
    {
        Assert.NotNull(fw.Failure);
        Assert.Contains(reason, fw.Failure!.Reason);
        Assert.InRange(fw.Failure.TimeS, 0.5, 0.54);
        Assert.Contains("during step at t = 0.52 s, call 26", fw.Failure.Reason);
        Assert.Null(fw.Scores);
        Assert.NotEmpty(fw.Failure.Recent);
        Assert.True(fw.Failure.Recent.Count <= TrackerLane.RecentCalls);
        Assert.Equal(0.52, fw.Failure.Recent[^1].TimeS, 9);
    }

    [Fact]
    public void ASegfaultIsReportedAsSigsegvWithTimeAndCall() =>
        AssertFailedAfterHalfASecond(RunFaulty("*(volatile int*)0 = 1;", name: "segv"), "killed by SIGSEGV");

    [Fact]
    public void AnAbortIsReportedAsSigabrt() =>
        AssertFailedAfterHalfASecond(RunFaulty("abort();", name: "abrt"), "killed by SIGABRT");

    [Fact]
    public void ExitZeroDuringAStepIsAFailureNotASuccess() =>
        AssertFailedAfterHalfASecond(RunFaulty("exit(0);", name: "exit0"), "exited with code 0");

    [Fact]
    public void AStackOverflowIsReportedAsASignal() =>
        AssertFailedAfterHalfASecond(RunFaulty("return recurse(0);", name: "overflow"), "killed by SIG");

    [Fact]
    public void AnEndlessLoopIsStoppedAtTheCallLimit() =>
        AssertFailedAfterHalfASecond(RunFaulty("for (;;) { }", ", limits: { call_ms: 200 }", "spin"), "no reply within 0.2 s");

    [Fact]
    public void ASlowCallIsStoppedAtTheCallLimit() =>
        AssertFailedAfterHalfASecond(RunFaulty("usleep(500000);", ", limits: { call_ms: 100 }", "slow"), "no reply within 0.1 s");

    [Fact]
    public void SlowCallsWithinTheCallLimitAreStoppedAtTheRunLimit()
    {
        var fw = RunFaulty("usleep(50000);", ", limits: { run_s: 0.3 }", "slowrun");
        Assert.Contains("used more than its run limit of 0.3 s", fw.Failure!.Reason);
        Assert.InRange(fw.Failure.TimeS, 0.559, 0.7); // from t = 0.56 s (the sample instant, which may round just below it) on
    }

    [Fact]
    public void UnboundedAllocationIsStoppedAtTheMemoryLimit() =>
        AssertFailedAfterHalfASecond(
            RunFaulty("for (;;) { char* b = malloc(1 << 20); if (b) memset(b, 1, 1 << 20); }", ", limits: { memory_mib: 200, call_ms: 60000 }", "alloc"), // the call limit well out of the way on a loaded machine
            "exceeded 200 MiB of memory");

    [Fact]
    public void PrintfGoesToTheLogAndNotIntoTheProtocol()
    {
        string lib = FaultyLibraries.Build("chatty", "printf(\"duty register %f\\n\", g_reference); fprintf(stderr, \"t=%f\\n\", m->time_s); fflush(stdout);");
        var log = new StringWriter();
        var result = new ScenarioRunner().Run(TestScenarios.Parse(Scenario($"- {{ name: fw, type: native, library: '{lib}', period_ms: 20 }}")), logFor: spec => spec.Name == "fw" ? log : null);
        var fw = result.Trackers.Single(t => t.Name == "fw");
        Assert.Null(fw.Failure);
        Assert.True(fw.Scores!.TrackingEfficiency > 0.9, $"efficiency {fw.Scores.TrackingEfficiency}");
        string text = log.ToString();
        Assert.Contains("duty register", text);
        Assert.Contains("t=0.52", text);
    }

    [Fact]
    public void AReturnedNaNAndAnOutOfRangeCommandAreNamed()
    {
        Assert.Contains("non-finite", RunFaulty("return NAN;", name: "nan2").Failure!.Reason);
        Assert.Contains("outside the converter's range", RunFaulty("return 1e6;", name: "huge").Failure!.Reason);
    }
}
