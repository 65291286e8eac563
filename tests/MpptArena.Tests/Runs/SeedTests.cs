using MpptArena.Reports.Comparison;
using MpptArena.Reports.Summary;
using MpptArena.Runs;

namespace MpptArena.Tests.Runs;

public class SeedTests
{
    private static string Noisy(string seeds) => TestScenarios.Yaml(
        converter: "type: boost\n  bus_voltage_v: 700",
        environment: "irradiance_w_m2:\n    - start: 900\n    - hold_s: 0.5\n    - ramp: { to: 500, rate_per_s: 400 }\n    - hold_s: 0.5\n  cell_temperature_c: 40",
        trackers: "- { name: po, type: perturb_observe, period_ms: 10 }\n- { name: inc, type: incremental_conductance, period_ms: 10 }",
        simulation: $"duration_s: 2\n  plant_step_us: 200\n  {seeds}",
        sensors: "voltage: { bits: 12, full_scale_v: 500, noise_rms_v: 0.5 }\n  current: { bits: 12, full_scale_a: 12, noise_rms_a: 0.02 }");

    [Fact]
    public void SeedsAreACountFromSeedOrAList()
    {
        Assert.Equal([7UL, 8UL, 9UL], TestScenarios.Parse(Noisy("seed: 7\n  seeds: 3")).Simulation.SeedList);
        Assert.Equal([1UL, 2UL], TestScenarios.Parse(Noisy("seeds: 2")).Simulation.SeedList);
        Assert.Equal([5UL, 9UL], TestScenarios.Parse(Noisy("seeds: [5, 9]")).Simulation.SeedList);
        Assert.Equal([4UL], TestScenarios.Parse(Noisy("seed: 4")).Simulation.SeedList);
    }

    [Theory]
    [InlineData("seeds: [5, 5]", "twice")]
    [InlineData("seed: 3\n  seeds: [5, 6]", "not both")]
    [InlineData("seeds: 0", "seeds")]
    [InlineData("seeds: [5, -1]", "whole number")]
    [InlineData("seeds: 10001", "seeds")]
    public void BadSeedsAreRefusedWithTheirPosition(string seeds, string words)
    {
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(Noisy(seeds)));
        Assert.Contains(words, e.Message);
        Assert.NotNull(e.Location);
        Assert.Equal("test.yaml", e.Location!.File);
    }

    [Fact]
    public void EachSeedOfAMultiSeedRunIsTheSingleSeedRunAndTheMeanIsTheirMean()
    {
        var multi = MultiSeedRunner.Run(TestScenarios.Parse(Noisy("seeds: [21, 22, 23]")), threads: 2);
        var summary = SummaryBuilder.Build(multi);
        Assert.Equal([21UL, 22UL, 23UL], summary.Scenario.Seeds);
        var singles = new[] { 21, 22, 23 }.Select(s => SummaryBuilder.Build(TestScenarios.Run(Noisy($"seed: {s}")))).ToList();
        foreach (var (t, k) in summary.Trackers.Select((t, k) => (t, k)))
        {
            Assert.Equal(3, t.PerSeed!.Count);
            for (int s = 0; s < 3; s++)
            {
                Assert.Equal(singles[s].Trackers[k].Scores, t.PerSeed[s].Scores);
            }
            double mean = singles.Average(x => x.Trackers[k].Scores["tracking_efficiency"]!.Value);
            Assert.Equal(mean, t.Scores["tracking_efficiency"]!.Value, 1e-15);
            var st = t.Statistics!["tracking_efficiency"];
            Assert.Equal(3, st.Seeds);
            Assert.True(st.ConfidenceLow <= st.Mean && st.Mean <= st.ConfidenceHigh);
            Assert.Equal(singles.Min(x => x.Trackers[k].Scores["tracking_efficiency"]!.Value), st.Min);
        }
        Assert.NotEqual(summary.Trackers[0].PerSeed![0].Scores["tracking_efficiency"], summary.Trackers[0].PerSeed![1].Scores["tracking_efficiency"]);
    }

    [Fact]
    public void MultiSeedResultsDoNotDependOnTheThreadCount()
    {
        var scenario = TestScenarios.Parse(Noisy("seeds: 4"));
        string one = SummaryJson.Serialize(SummaryBuilder.Build(MultiSeedRunner.Run(scenario, threads: 1)));
        string three = SummaryJson.Serialize(SummaryBuilder.Build(MultiSeedRunner.Run(scenario, threads: 3)));
        Assert.Equal(one, three);
    }

    [Fact]
    public void ASingleSeedSummaryCarriesNoStatistics()
    {
        var summary = SummaryBuilder.Build(TestScenarios.Run(Noisy("seed: 5")));
        Assert.Equal([5UL], summary.Scenario.Seeds);
        Assert.All(summary.Trackers, t => { Assert.Null(t.Statistics); Assert.Null(t.PerSeed); });
        Assert.Null(summary.Indistinguishable);
    }

    private static RunSummary Shift(RunSummary s, Func<int, double> deltaOfSeed)
    {
        var trackers = s.Trackers.Select(t =>
        {
            var perSeed = t.PerSeed!.Select((p, k) =>
            {
                var scores = new SortedDictionary<string, double?>(p.Scores, StringComparer.Ordinal);
                scores["tracking_efficiency"] = scores["tracking_efficiency"]!.Value + deltaOfSeed(k);
                return p with { Scores = scores };
            }).ToList();
            return t with { PerSeed = perSeed };
        }).ToList();
        return s with { Trackers = trackers };
    }

    [Fact]
    public void PairedCompareFindsAOneInAThousandLossThatTheSeedSpreadHides()
    {
        // Paired comparison (Student's paired t interval, NIST/SEMATECH e-Handbook sec. 7.3.1): the same seed is the
        // same sensor noise for baseline and current, so the noise cancels seed by seed.
        var baseline = SummaryBuilder.Build(MultiSeedRunner.Run(TestScenarios.Parse(Noisy("seeds: 6")), threads: 2));
        var spread = baseline.Trackers[0].Statistics!["tracking_efficiency"].StandardDeviation!.Value;
        var tolerances = new ToleranceSet();
        tolerances.ParseOption("tracking_efficiency=0.0005");

        var worse = Shift(baseline, k => -0.001 + (k % 2 == 0 ? 2e-4 : -2e-4));
        var change = SummaryComparer.Compare(baseline, worse, tolerances).Single(c => c.Tracker == "po" && c.Score == "tracking_efficiency");
        Assert.Equal(ScoreVerdict.Regressed, change.Verdict);
        Assert.NotNull(change.Paired);
        Assert.Equal(-0.001, change.Paired!.Mean, 1e-12);

        // Noise of the size of the seed spread, centred on zero: not a change.
        var noise = Shift(baseline, k => (k % 2 == 0 ? 1 : -1) * spread);
        Assert.Equal(ScoreVerdict.Unchanged, SummaryComparer.Compare(baseline, noise, tolerances).Single(c => c.Tracker == "po" && c.Score == "tracking_efficiency").Verdict);

        var same = SummaryComparer.Compare(baseline, baseline, new ToleranceSet());
        Assert.DoesNotContain(same, c => c.IsRegression);
    }

    [Fact]
    public void SummariesOfTheFirstSchemaAreStillCompared()
    {
        var current = SummaryBuilder.Build(TestScenarios.Run(Noisy("seed: 5")));
        var node = System.Text.Json.Nodes.JsonNode.Parse(SummaryJson.Serialize(current))!;
        node["schema"] = RunSummary.PreviousSchemaId;
        node["scenario"]!.AsObject().Remove("seeds");
        node.AsObject().Remove("indistinguishable");
        foreach (var t in node["trackers"]!.AsArray())
        {
            foreach (string key in new[] { "failure_seed", "statistics", "per_seed", "energy_split", "stall" }) t!.AsObject().Remove(key);
        }
        var old = SummaryJson.Deserialize(node.ToJsonString(), "old.json");
        Assert.Null(old.Scenario.Seeds);
        Assert.DoesNotContain(SummaryComparer.Compare(old, current, new ToleranceSet()), c => c.IsRegression);
    }
}
