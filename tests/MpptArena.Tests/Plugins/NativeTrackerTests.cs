using MpptArena.Runs;
using MpptArena.Trackers.Native;

namespace MpptArena.Tests.Plugins;

public class NativeTrackerTests
{
    private const string Minimal = """
        #include <math.h>
        #include <stdlib.h>
        #include "mppt_arena_tracker.h"
        MPPT_ARENA_EXPORT uint32_t mppt_arena_abi_version(void) { return VERSION; }
        MPPT_ARENA_EXPORT int32_t mppt_arena_command_kind(void) { return MPPT_ARENA_VOLTAGE_REFERENCE; }
        MPPT_ARENA_EXPORT void* mppt_arena_create(const mppt_arena_parameter* p, int32_t n, const mppt_arena_context* c, double* first)
        { (void)p; (void)n; *first = 0.7 * c->nominal_open_circuit_voltage_v; return calloc(1, 16); }
        STEP
        MPPT_ARENA_EXPORT void mppt_arena_destroy(void* t) { free(t); }
        """;

    private static string Library(string folder, string name, string version = "MPPT_ARENA_ABI_VERSION", string? step = null) =>
        CCompiler.SharedLibrary(folder, name, Minimal.Replace("VERSION", version).Replace("STEP", step ??
            "MPPT_ARENA_EXPORT double mppt_arena_step(void* t, const mppt_arena_measurement* m) { (void)t; return m->previous_command; }"));

    private static string BuildExample()
    {
        string folder = CCompiler.Folder();
        var (exit, output) = CCompiler.Run("sh", Path.Combine(RepoRoot.Path, "examples", "c-perturb-observe", "build.sh"), folder);
        Assert.True(exit == 0, "build.sh failed: " + output);
        return output.Trim().Split('\n')[^1];
    }

    [Fact]
    public void FixedPointCExampleScoresLikeTheBuiltInPerturbAndObserve()
    {
        // The C example makes the same decisions as the C# P&O (power compared as products of code sums);
        // only the Q16.16 rounding of step and reference differs, so the two agree to within that rounding.
        string lib = BuildExample();
        var yaml = TestScenarios.Yaml(
            converter: "type: boost\n  bus_voltage_v: 700",
            environment: "irradiance_w_m2:\n    - start: 850\n    - hold_s: 1\n    - ramp: { to: 450, rate_per_s: 200 }\n    - hold_s: 1\n  cell_temperature_c: 35",
            trackers: $"- {{ name: c-po, type: native, library: '{lib}', period_ms: 10, parameters: {{ step_v: 1.5 }} }}\n- {{ name: po, type: perturb_observe, period_ms: 10, parameters: {{ step_v: 1.5 }} }}",
            simulation: "duration_s: 4\n  plant_step_us: 50\n  seed: 9\n  series_interval_ms: 10",
            sensors: "voltage: { bits: 12, full_scale_v: 500, noise_rms_v: 0.3, averaging_samples: 4, averaging_window_us: 400 }\n  current: { bits: 12, full_scale_a: 12, noise_rms_a: 0.01, averaging_samples: 4, averaging_window_us: 400 }");
        var sinks = new Dictionary<string, ListSink>();
        var result = TestScenarios.Run(yaml, spec => sinks[spec.Name] = new ListSink());
        var c = result.Trackers.Single(t => t.Name == "c-po");
        var cs = result.Trackers.Single(t => t.Name == "po");
        Assert.Null(c.Failure);
        Assert.Equal(cs.Scores!.TrackingEfficiency, c.Scores!.TrackingEfficiency, 1e-4);
        double lsb = 500.0 / 4096;
        // Q16 rounding can tip a decision where two powers are nearly equal; the trajectories then part for a
        // few samples and meet again on the same three-level cycle. So: nearly every sample within one code.
        var commands = sinks["c-po"].Rows.Zip(sinks["po"].Rows, (a, b) => Math.Abs(a.Command - b.Command)).ToList();
        double within = commands.Count(d => d < lsb) / (double)commands.Count;
        Assert.True(within > 0.95, $"{within:P1} of samples within one code ({lsb:G3} V); largest difference {commands.Max():G3} V");
        Assert.Equal(sinks["po"].Rows.Average(r => r.Command), sinks["c-po"].Rows.Average(r => r.Command), lsb);
        Assert.Equal(["start_fraction", "step_v"], NativeTrackerLibrary.Load(lib).Parameters.Select(p => p.Name).Order());
    }

    [Fact]
    public void AbiMismatchNamesTheLibraryAndBothVersions()
    {
        string lib = Library(CCompiler.Folder(), "future", version: "7u");
        var e = Assert.Throws<ArenaInputException>(() => NativeTrackerLibrary.Load(lib));
        Assert.Contains("libfuture", e.Message);
        Assert.Contains("ABI 7", e.Message);
        Assert.Contains("ABI 1", e.Message);
    }

    [Fact]
    public void MissingSymbolIsNamed()
    {
        string lib = Library(CCompiler.Folder(), "nostep", step: "");
        var e = Assert.Throws<ArenaInputException>(() => NativeTrackerLibrary.Load(lib));
        Assert.Contains("libnostep", e.Message);
        Assert.Contains("'mppt_arena_step'", e.Message);
    }

    [Fact]
    public void ANativeTrackerReturningNaNIsStoppedAndTheOthersCarryOn()
    {
        string lib = Library(CCompiler.Folder(), "nan", step:
            "MPPT_ARENA_EXPORT double mppt_arena_step(void* t, const mppt_arena_measurement* m) { (void)t; return m->time_s > 0.5 ? NAN : m->previous_command; }");
        var yaml = TestScenarios.Yaml(trackers: $"- {{ name: broken, type: native, library: '{lib}', period_ms: 10 }}\n- {{ name: po, type: perturb_observe, period_ms: 10 }}");
        var result = TestScenarios.Run(yaml);
        var broken = result.Trackers.Single(t => t.Name == "broken");
        Assert.Contains("non-finite", broken.Failure!.Reason);
        Assert.InRange(broken.Failure.TimeS, 0.5, 0.52);
        Assert.True(result.Trackers.Single(t => t.Name == "po").Scores!.TrackingEfficiency > 0.95);
    }

    [Fact]
    public void MissingLibraryInAScenarioIsReportedAtItsLine()
    {
        string yaml = TestScenarios.Yaml(trackers: "- { name: x, type: native, library: no/such/libtracker.so }");
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(yaml));
        Assert.Contains("not found", e.Message);
        Assert.NotNull(e.Location);
    }
}
