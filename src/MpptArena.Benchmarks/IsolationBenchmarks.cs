using System.Diagnostics;
using BenchmarkDotNet.Attributes;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Sweeps;
using MpptArena.Trackers;
using MpptArena.Trackers.Isolation;
using MpptArena.Trackers.Native;

namespace MpptArena.Benchmarks;

/// <summary>
/// What isolation costs: one tracker call through a host (shared slot and plain frames) against the same
/// C library in process, a host's start-up, and the demo and EN 50530 block with the C example P&amp;O
/// isolated and in process. The C example is built with the machine's cc at set-up.
/// </summary>
public class IsolationBenchmarks
{
    private IsolatedTracker _slot = null!;
    private NativeTracker _inProcess = null!;
    private TrackerHost _framesHost = null!;
    private TrackerMeasurement _m;
    private string _library = null!;
    private Scenario _demoIsolated = null!, _demoInProcess = null!, _blockIsolated = null!, _blockInProcess = null!;

    [GlobalSetup]
    public void Setup()
    {
        string root = RunThroughputBenchmarks.FindRoot();
        string folder = Directory.CreateTempSubdirectory("mppt-arena-bench-").FullName;
        var build = Process.Start(new ProcessStartInfo("sh", [Path.Combine(root, "examples", "c-perturb-observe", "build.sh"), folder]) { RedirectStandardOutput = true })!;
        _library = build.StandardOutput.ReadToEnd().Trim().Split('\n')[^1];
        build.WaitForExit();
        var registry = TrackerRegistry.WithBuiltIns();
        var lib = NativeTrackerLibrary.Load(_library);
        var settings = new TrackerSettings(lib.Parameters, new Dictionary<string, double>());
        var context = new TrackerContext(0.01, 0, 1000, 380, 9.5, 500.0 / 4096, 12.0 / 4096, 12, 12);
        var launch = TrackerHostLaunch.ForNativeLibrary(_library);
        var descriptor = IsolatedTrackers.Describe("native", launch, _library, TrackerOrigin.Native, _library);
        _slot = (IsolatedTracker)descriptor.Create(settings);
        _slot.Reset(context);
        // Plain frames: a pool of its own whose hosts are started without the shared slot.
        _framesHost = TrackerHost.Start(launch, TrackerLimits.Default, useSharedSlot: false);
        _framesHost.Create(context, settings.All);
        _inProcess = (NativeTracker)lib.Descriptor.Create(settings);
        _inProcess.Reset(context);
        _m = new TrackerMeasurement(0.01, 300, 8, 2457, 2730, 300, 4);

        var demo = ScenarioLoader.Load(Path.Combine(root, "scenarios", "demo-moving-shadow.yaml"), registry);
        var ramps = ScenarioLoader.Load(Path.Combine(root, "scenarios", "en50530-low-ramps.yaml"), registry);
        var isolated = new TrackerSpec("c-po", descriptor, settings, 0.01);
        var inProcess = new TrackerSpec("c-po", lib.Descriptor, settings, 0.01);
        _demoIsolated = demo with { Trackers = [isolated] };
        _demoInProcess = demo with { Trackers = [inProcess] };
        var block = RunThroughputBenchmarks.LastBlock(ramps, 360) with { Simulation = ramps.Simulation with { DurationS = 360, SeriesIntervalS = 0 } };
        _blockIsolated = block with { Trackers = [isolated] };
        _blockInProcess = block with { Trackers = [inProcess] };
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _slot.Dispose();
        _framesHost.Dispose();
        _inProcess.Dispose();
    }

    [Benchmark(Description = "tracker call, in process (C library)")]
    public double CallInProcess() => _inProcess.Step(_m);

    [Benchmark(Description = "tracker call, isolated, shared slot")]
    public double CallSharedSlot() => _slot.Step(_m);

    [Benchmark(Description = "tracker call, isolated, frames on pipes")]
    public double CallFrames() => _framesHost.Step(_m, 1);

    [Benchmark(Description = "host start-up and end (HELLO, shared slot mapped)")]
    public int HostStartUp()
    {
        using var host = TrackerHost.Start(TrackerHostLaunch.ForNativeLibrary(_library), TrackerLimits.Default);
        return host.ProcessId;
    }

    [Benchmark(Description = "demo (boost, 60 s), C P&O isolated")]
    public double DemoIsolated() => new ScenarioRunner().Run(_demoIsolated).Trackers[0].Scores!.TrackingEfficiency;

    [Benchmark(Description = "demo (boost, 60 s), C P&O in process")]
    public double DemoInProcess() => new ScenarioRunner().Run(_demoInProcess).Trackers[0].Scores!.TrackingEfficiency;

    [Benchmark(Description = "EN 50530 50 W/m2/s block (boost, 360 s), C P&O isolated")]
    public double BlockIsolated() => new ScenarioRunner().Run(_blockIsolated).Trackers[0].Scores!.TrackingEfficiency;

    [Benchmark(Description = "EN 50530 50 W/m2/s block (boost, 360 s), C P&O in process")]
    public double BlockInProcess() => new ScenarioRunner().Run(_blockInProcess).Trackers[0].Scores!.TrackingEfficiency;
}
