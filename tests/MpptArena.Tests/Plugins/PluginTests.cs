using MpptArena.Trackers;

namespace MpptArena.Tests.Plugins;

public class PluginTests
{
    internal static string SamplePlugin =>
        Path.Combine(RepoRoot.Path, "tests", "SamplePlugin", "bin",
            AppContext.BaseDirectory.Contains($"{Path.DirectorySeparatorChar}Release{Path.DirectorySeparatorChar}") ? "Release" : "Debug", "net10.0", "SamplePlugin.dll");

    [Fact]
    public void TrackerIsLoadedFromAnAssemblyPathAndRunsLikeABuiltIn()
    {
        var registry = TrackerRegistry.WithBuiltIns();
        var kinds = TrackerPluginLoader.LoadInto(registry, SamplePlugin);
        Assert.Equal(["sample_fraction", "sample_faulty"], kinds.Order().Reverse());
        var yaml = TestScenarios.Yaml(trackers: "- { name: mine, type: sample_fraction, period_ms: 10, parameters: { fraction: 0.8 } }")
                   + $"\nplugins: [ '{SamplePlugin}' ]\n";
        var result = TestScenarios.Run(yaml);
        Assert.Null(result.Trackers[0].Failure);
        Assert.InRange(result.Trackers[0].Scores!.TrackingEfficiency, 0.9, 1.0);
    }

    [Fact]
    public void UndeclaredParameterOfAPluginIsRefused()
    {
        var yaml = TestScenarios.Yaml(trackers: "- { name: mine, type: sample_fraction, parameters: { speed: 3 } }") + $"\nplugins: [ '{SamplePlugin}' ]\n";
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(yaml));
        Assert.Contains("unknown key 'speed'", e.Message);
        Assert.Contains("fraction", e.Message);
    }

    [Fact]
    public void AnAssemblyWithoutTrackersMissingFilesAndWrongShapesGetClearMessages()
    {
        var registry = TrackerRegistry.WithBuiltIns();
        var none = Assert.Throws<ArenaInputException>(() => TrackerPluginLoader.LoadInto(registry, Path.Combine(AppContext.BaseDirectory, "MpptArena.Reports.dll")));
        Assert.Contains("holds no public class marked [TrackerKind", none.Message);
        var missing = Assert.Throws<ArenaInputException>(() => TrackerPluginLoader.LoadInto(registry, "nowhere/Tracker.dll"));
        Assert.Contains("not found", missing.Message);
        var shape = Assert.Throws<ArenaInputException>(() => TrackerPluginLoader.Describe(typeof(NoSettingsConstructor), new TrackerKindAttribute("bad"), "test"));
        Assert.Contains("public constructor taking TrackerSettings", shape.Message);
        var notTracker = Assert.Throws<ArenaInputException>(() => TrackerPluginLoader.Describe(typeof(PluginTests), new TrackerKindAttribute("bad"), "test"));
        Assert.Contains("does not implement IMpptTracker", notTracker.Message);
    }

    private sealed class NoSettingsConstructor : IMpptTracker
    {
        public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;
        public double Reset(TrackerContext context) => 0;
        public double Step(in TrackerMeasurement measurement) => 0;
    }
}
