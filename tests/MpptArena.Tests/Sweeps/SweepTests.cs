using MpptArena.Cli.Commands;
using MpptArena.Sweeps;
using MpptArena.Tests.Cli;
using MpptArena.Trackers;

namespace MpptArena.Tests.Sweeps;

public class SweepTests
{
    /// <summary>A small sweep: two short scenarios, 2 x 3 P&O settings and 2 constant-voltage settings: 16 cases.</summary>
    private static string SmallSweep(string dir)
    {
        File.WriteAllText(Path.Combine(dir, "a.yaml"), TestScenarios.Yaml(
            environment: "irradiance_w_m2:\n    - start: 900\n    - hold_s: 0.6\n    - step: 500\n    - hold_s: 0.6\n  cell_temperature_c: 30",
            simulation: "duration_s: 1.2\n  plant_step_us: 200").Replace("name: test-case", "name: step-case"));
        File.WriteAllText(Path.Combine(dir, "b.yaml"), TestScenarios.Yaml(
            environment: "irradiance_w_m2: 700\n  cell_temperature_c: 45\n  shading:\n    - { modules: [ {string: 1, module: 1}, {string: 1, module: 2} ], transmittance: 0.4 }",
            simulation: "duration_s: 1.2\n  plant_step_us: 200\n  seed: 5",
            sensors: "voltage: { bits: 12, full_scale_v: 500, noise_rms_v: 0.4 }\n  current: { bits: 12, full_scale_a: 12, noise_rms_a: 0.02 }").Replace("name: test-case", "name: shade-case"));
        string sweep = Path.Combine(dir, "sweep.yaml");
        File.WriteAllText(sweep, """
            name: small
            scenarios: [a.yaml, b.yaml]
            trackers:
              - name: po
                type: perturb_observe
                period_ms: [10, 20]
                parameters:
                  step_v: { from: 1, to: 3, step: 1 }
              - name: cv
                type: constant_voltage
                parameters:
                  fraction: [0.74, 0.8]
            """);
        return sweep;
    }

    private static SweepDefinition Load(string file) => SweepLoader.Load(file, TrackerRegistry.WithBuiltIns());

    private static IEnumerable<(string Name, byte[] Bytes)> Deterministic(string folder) =>
        new[] { "cases.csv", "cases.json", "best.md", "sweep.json" }.Select(f => (f, File.ReadAllBytes(Path.Combine(folder, f))))
            .Concat(Directory.GetFiles(Path.Combine(folder, "cases"), "*.json").Order(StringComparer.Ordinal)
                .Select(f => ("cases/" + Path.GetFileName(f), File.ReadAllBytes(f))));

    [Fact]
    public void ShardsPartitionTheCasesExactlyOnce()
    {
        var cases = SweepPlanner.Cases(Load(SmallSweep(CliProcess.TempFolder())));
        Assert.Equal(16, cases.Count);
        Assert.Equal(cases.Count, cases.Select(c => c.Id).Distinct().Count());
        for (int n = 1; n <= 7; n++)
        {
            var union = Enumerable.Range(1, n).SelectMany(k => SweepPlanner.Shard(cases, k, n)).Select(c => c.Id).ToList();
            Assert.Equal(cases.Count, union.Count);
            Assert.Equal(cases.Select(c => c.Id).Order(), union.Order());
        }
        // Stable: the same case lands in the same shard every time the sweep is planned.
        var again = SweepPlanner.Cases(Load(SmallSweep(CliProcess.TempFolder())));
        Assert.Equal(cases.Select(c => c.ShardOf(5)), again.Select(c => c.ShardOf(5)));
    }

    [Fact]
    public void ShardsRunAsSeparateProcessesMergeIntoExactlyTheSingleRunAndThreadsDoNotMatter()
    {
        string dir = CliProcess.TempFolder();
        string sweep = SmallSweep(dir);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "single", "--threads", "2", "--no-plots").Exit);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "one-thread", "--threads", "1", "--no-plots").Exit);
        for (int k = 1; k <= 3; k++) Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--shard", $"{k}/3", "--out", $"shard{k}", "--no-plots").Exit);
        var merged = CliProcess.Run(dir, "merge", "shard1", "shard2", "shard3", "--out", "merged", "--no-plots");
        Assert.True(merged.Exit == 0, merged.Err);
        var single = Deterministic(Path.Combine(dir, "single")).ToList();
        Assert.Equal(single.Select(f => f.Name), Deterministic(Path.Combine(dir, "merged")).Select(f => f.Name));
        foreach (var (a, b) in single.Zip(Deterministic(Path.Combine(dir, "merged")))) Assert.True(a.Bytes.SequenceEqual(b.Bytes), $"{a.Name} differs after merge");
        foreach (var (a, b) in single.Zip(Deterministic(Path.Combine(dir, "one-thread")))) Assert.True(a.Bytes.SequenceEqual(b.Bytes), $"{a.Name} differs with one thread");

        var missing = CliProcess.Run(dir, "merge", "shard1", "shard3", "--out", "incomplete");
        Assert.Equal(2, missing.Exit);
        Assert.Contains("shards not given: 2", missing.Err);
    }

    [Fact]
    public void AnInterruptedSweepResumesToTheSameResult()
    {
        string dir = CliProcess.TempFolder();
        string sweep = SmallSweep(dir);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "full", "--no-plots").Exit);
        // An interrupted run: the arena's mark and manifest, half the case files, a truncated file and a stray temporary file.
        string cut = Path.Combine(dir, "cut", "cases");
        Directory.CreateDirectory(cut);
        File.Copy(Path.Combine(dir, "full", "sweep.json"), Path.Combine(dir, "cut", "sweep.json"));
        File.Copy(Path.Combine(dir, "full", "mppt-arena-output.json"), Path.Combine(dir, "cut", "mppt-arena-output.json"));
        var files = Directory.GetFiles(Path.Combine(dir, "full", "cases")).Order(StringComparer.Ordinal).ToList();
        foreach (string f in files.Take(files.Count / 2)) File.Copy(f, Path.Combine(cut, Path.GetFileName(f)));
        string truncated = files[^1];
        File.WriteAllText(Path.Combine(cut, Path.GetFileName(truncated)), File.ReadAllText(truncated)[..40]);
        File.WriteAllText(Path.Combine(cut, ".deadbeef.1.1.tmp"), "{");
        var resumed = CliProcess.Run(dir, "sweep", sweep, "--out", "cut", "--no-plots");
        Assert.Equal(0, resumed.Exit);
        Assert.Contains($"{files.Count / 2} already done", resumed.Out);
        foreach (var (a, b) in Deterministic(Path.Combine(dir, "full")).Zip(Deterministic(Path.Combine(dir, "cut")))) Assert.True(a.Bytes.SequenceEqual(b.Bytes), $"{a.Name} differs after resuming");
    }

    [Fact]
    public void AChangedInputRerunsTheCasesItAffectsAndShardsOfOtherInputsDoNotMerge()
    {
        string dir = CliProcess.TempFolder();
        string sweep = SmallSweep(dir);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "kept", "--no-plots").Exit);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "old-shard1", "--shard", "1/2", "--no-plots").Exit);
        string b = Path.Combine(dir, "b.yaml");
        File.WriteAllText(b, File.ReadAllText(b).Replace("seed: 5", "seed: 6"));

        var resumed = CliProcess.Run(dir, "sweep", sweep, "--out", "kept", "--no-plots");
        Assert.True(resumed.Exit == 0, resumed.Err);
        Assert.Contains("scenario shade-case changed", resumed.Out);
        Assert.Contains("8 already done, running 8", resumed.Out);
        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "fresh", "--no-plots").Exit);
        foreach (var (x, y) in Deterministic(Path.Combine(dir, "fresh")).Zip(Deterministic(Path.Combine(dir, "kept")))) Assert.True(x.Bytes.SequenceEqual(y.Bytes), $"{x.Name} is stale after the input changed");

        Assert.Equal(0, CliProcess.Run(dir, "sweep", sweep, "--out", "new-shard2", "--shard", "2/2", "--no-plots").Exit);
        var mixed = CliProcess.Run(dir, "merge", "old-shard1", "new-shard2", "--out", "merged");
        Assert.Equal(2, mixed.Exit);
        Assert.Contains("scenario shade-case changed", mixed.Err);
        var ontoInput = CliProcess.Run(dir, "merge", "old-shard1", "new-shard2", "--out", "old-shard1");
        Assert.Equal(2, ontoInput.Exit);
        Assert.Contains("shard folder", ontoInput.Err);
        Assert.False(Directory.Exists(Path.Combine(dir, "merged")));
    }

    [Fact]
    public void TunerFindsTheKnownOptimumOfASyntheticObjective()
    {
        // f(x, y) = (x - 1.3)^2 + 2 (y + 0.4)^2 has its minimum 0 at (1.3, -0.4), inside the box.
        var (best, value, history) = ParameterTuner.Minimise(v => Math.Pow(v[0] - 1.3, 2) + 2 * Math.Pow(v[1] + 0.4, 2), [-2, -1], [3, 1], [0, 0.5], 400, 1e-10);
        Assert.Equal(1.3, best[0], 1e-3);
        Assert.Equal(-0.4, best[1], 1e-3);
        Assert.True(value < 1e-5);
        Assert.True(history.Count <= 400);
        // An optimum outside the box is found on its boundary.
        var (edge, _, _) = ParameterTuner.Minimise(v => Math.Pow(v[0] - 5, 2), [0], [2], [1], 200, 1e-10);
        Assert.Equal(2.0, edge[0], 1e-3);
    }

    [Fact]
    public void LatinHypercubeUsesEveryStratumOncePerAxis()
    {
        // McKay, Beckman, Conover, Technometrics 21(2), 1979: each of the N strata of each axis holds one sample.
        string dir = CliProcess.TempFolder();
        SmallSweep(dir);
        string file = Path.Combine(dir, "lhs.yaml");
        File.WriteAllText(file, "name: lhs\nscenarios: [a.yaml]\ntrackers:\n  - name: po\n    type: perturb_observe\n    parameters:\n      step_v: { from: 1, to: 5, step: 1 }\n      start_fraction: { from: 0.6, to: 0.9 }\nsampling: { method: latin_hypercube, count: 8, seed: 3 }\n");
        var cases = SweepPlanner.Cases(Load(file));
        Assert.Equal(8, cases.Count);
        foreach (var (name, lo, hi) in new[] { ("step_v", 1.0, 5.0), ("start_fraction", 0.6, 0.9) })
        {
            var strata = cases.Select(c => (int)Math.Floor((c.Parameters.First(p => p.Key == name).Value - lo) / (hi - lo) * 8)).Order().ToList();
            Assert.Equal(Enumerable.Range(0, 8), strata);
        }
    }

    [Fact]
    public void SampledListsAndPeriodsAreChoicesNotRanges()
    {
        // A list names the values to try (common practice for sweep files); a sample period must also stay a
        // whole number of plant steps, so random sampling picks among the listed periods.
        string dir = CliProcess.TempFolder();
        SmallSweep(dir);
        string file = Path.Combine(dir, "choices.yaml");
        File.WriteAllText(file, "name: choices\nscenarios: [a.yaml]\ntrackers:\n  - name: po\n    type: perturb_observe\n    period_ms: [10, 20, 40]\n    parameters:\n      step_v: { from: 1, to: 5 }\n      start_fraction: [0.6, 0.9]\nsampling: { method: random, count: 30, seed: 4 }\n");
        var cases = SweepPlanner.Cases(Load(file));
        Assert.Equal(30, cases.Count);
        Assert.All(cases, c => Assert.Contains(c.PeriodMs, new[] { 10.0, 20.0, 40.0 }));
        Assert.All(cases, c => Assert.Contains(c.Parameters.First(p => p.Key == "start_fraction").Value, new[] { 0.6, 0.9 }));
        Assert.Equal(3, cases.Select(c => c.PeriodMs).Distinct().Count());
        Assert.True(cases.Select(c => c.Parameters.First(p => p.Key == "step_v").Value).Distinct().Count() > 20, "a {from, to} range is drawn from continuously");
    }

    [Fact]
    public void SweepValuesOutsideADeclaredRangeAreRefusedWithTheirPosition()
    {
        string dir = CliProcess.TempFolder();
        SmallSweep(dir);
        string file = Path.Combine(dir, "bad.yaml");
        File.WriteAllText(file, "name: bad\nscenarios: [a.yaml]\ntrackers:\n  - name: po\n    type: perturb_observe\n    parameters:\n      step_v: [1, 2, 20000]\n");
        var e = Assert.Throws<ArenaInputException>(() => Load(file));
        Assert.Equal(7, e.Location!.Line);
        Assert.Contains("outside its declared range", e.Message);
    }

    [Theory]
    [InlineData("JOB_COMPLETION_INDEX=2,MPPT_ARENA_SHARD_COUNT=4", 3, 4)]
    [InlineData("SLURM_ARRAY_TASK_ID=5,SLURM_ARRAY_TASK_MIN=1,SLURM_ARRAY_TASK_COUNT=8", 5, 8)]
    [InlineData("SLURM_ARRAY_TASK_ID=0,SLURM_ARRAY_TASK_COUNT=3", 1, 3)]
    [InlineData("", 1, 1)]
    public void ShardComesFromTheBatchSystemsIndexVariables(string variables, int shard, int count)
    {
        var env = variables.Split(',', StringSplitOptions.RemoveEmptyEntries).Select(v => v.Split('=')).ToDictionary(v => v[0], v => v[1]);
        var (k, n, _) = ShardOption.Resolve(null, name => env.GetValueOrDefault(name));
        Assert.Equal((shard, count), (k, n));
        Assert.Equal((2, 5), (ShardOption.Resolve("2/5", _ => null).Shard, ShardOption.Resolve("2/5", _ => null).Count));
        Assert.Throws<ArenaInputException>(() => ShardOption.Resolve("6/5", _ => null));
    }

    [Theory]
    [InlineData("SLURM_ARRAY_TASK_ID=4,SLURM_ARRAY_TASK_MIN=4,SLURM_ARRAY_TASK_MAX=4,SLURM_ARRAY_TASK_COUNT=1")] // sbatch --array=4
    [InlineData("SLURM_ARRAY_TASK_ID=4,SLURM_ARRAY_TASK_MIN=1,SLURM_ARRAY_TASK_MAX=9,SLURM_ARRAY_TASK_COUNT=3")] // sbatch --array=1,4,9
    public void ASlurmArrayThatIsNotTheWholeShardingIsRefusedWithWhatItSaw(string variables)
    {
        // Slurm exports these for every array task (Slurm sbatch manual, "OUTPUT ENVIRONMENT VARIABLES");
        // a rerun of one task must not resolve to shard 1/1 and run the whole sweep under another name.
        var env = variables.Split(',').Select(v => v.Split('=')).ToDictionary(v => v[0], v => v[1]);
        var e = Assert.Throws<ArenaInputException>(() => ShardOption.Resolve(null, name => env.GetValueOrDefault(name)));
        Assert.Contains("SLURM_ARRAY_TASK_ID=4", e.Message);
        Assert.Contains("--shard \"$SLURM_ARRAY_TASK_ID/N\"", e.Message);
        // The explicit option wins over the variables, as the recipe passes it.
        Assert.Equal((4, 16), (ShardOption.Resolve("4/16", name => env.GetValueOrDefault(name)).Shard, ShardOption.Resolve("4/16", name => env.GetValueOrDefault(name)).Count));
    }
}
