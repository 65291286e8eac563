using System.Collections.Concurrent;
using MpptArena.Sweeps;
using MpptArena.Tests.Cli;
using MpptArena.Trackers;

namespace MpptArena.Tests.Isolation;

/// <summary>
/// Firmware keeps its state in globals. Isolated, every instance starts from the library's own initial
/// globals, so a tracker scores what it scores alone whatever runs beside it, before it, or on how many threads.
/// </summary>
public class GlobalsDeterminismTests
{
    private static readonly Lazy<string> Library = new(() => FaultyLibraries.Build("globals_po"));

    private static string Entry(string name, string options = "") => $"- {{ name: {name}, type: native, library: '{Library.Value}', period_ms: 20{options} }}";

    [Fact]
    public void TwoInstancesInOneRunScoreExactlyWhatOneScoresAlone()
    {
        double alone = TestScenarios.Run(TestScenarios.Yaml(trackers: Entry("solo"))).Trackers[0].Scores!.TrackingEfficiency;
        var twins = TestScenarios.Run(TestScenarios.Yaml(trackers: Entry("a") + "\n" + Entry("b")));
        Assert.Equal(alone, twins.Trackers[0].Scores!.TrackingEfficiency);
        Assert.Equal(alone, twins.Trackers[1].Scores!.TrackingEfficiency);
        // A second run, served by the pooled hosts of the first, is the same again.
        Assert.Equal(alone, TestScenarios.Run(TestScenarios.Yaml(trackers: Entry("again"))).Trackers[0].Scores!.TrackingEfficiency);
    }

    [Fact]
    public void InProcessTwinsShareTheirGlobalsWhichIsWhyIsolationIsTheDefault()
    {
        var twins = TestScenarios.Run(TestScenarios.Yaml(trackers: Entry("a", ", isolation: in_process") + "\n" + Entry("b", ", isolation: in_process")));
        var isolated = TestScenarios.Run(TestScenarios.Yaml(trackers: Entry("solo")));
        Assert.NotEqual(isolated.Trackers[0].Scores!.TrackingEfficiency, twins.Trackers[1].Scores?.TrackingEfficiency ?? double.NaN);
    }

    [Fact]
    public void ASweepScoresTheSameOnOneThreadAndOnTwo()
    {
        string dir = CliProcess.TempFolder();
        File.WriteAllText(Path.Combine(dir, "s.yaml"), TestScenarios.Yaml(
            environment: "irradiance_w_m2:\n    - start: 900\n    - hold_s: 0.6\n    - step: 500\n    - hold_s: 0.6\n  cell_temperature_c: 30",
            simulation: "duration_s: 1.2\n  plant_step_us: 200\n  seed: 4"));
        string sweepFile = Path.Combine(dir, "sweep.yaml");
        File.WriteAllText(sweepFile, $"""
            name: globals
            scenarios: [s.yaml]
            trackers:
              - name: fw
                type: native
                library: '{Library.Value}'
                period_ms: [10, 20, 40, 60]
            """);
        var sweep = SweepLoader.Load(sweepFile, TrackerRegistry.WithBuiltIns());
        var cases = SweepPlanner.Cases(sweep);
        Dictionary<string, double> Run(int threads)
        {
            var scores = new ConcurrentDictionary<string, double>();
            SweepExecutor.RunAll(sweep, cases, threads, (c, r) => scores[c.Id] = r.Trackers[0].Scores!.TrackingEfficiency);
            return new Dictionary<string, double>(scores);
        }
        var one = Run(1);
        var two = Run(2);
        var twoAgain = Run(2);
        Assert.Equal(4, one.Count);
        foreach (var (id, eta) in one)
        {
            Assert.Equal(eta, two[id]);
            Assert.Equal(eta, twoAgain[id]);
            var alone = SweepExecutor.Run(sweep, cases.Single(c => c.Id == id));
            Assert.Equal(eta, alone.Trackers[0].Scores!.TrackingEfficiency);
        }
    }
}
