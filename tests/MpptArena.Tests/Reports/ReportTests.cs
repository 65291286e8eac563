using System.Xml.Linq;
using MpptArena.Reports.Comparison;
using MpptArena.Reports.Exporters;
using MpptArena.Reports.Summary;
using MpptArena.Runs;

namespace MpptArena.Tests.Reports;

public class ReportTests
{
    private static readonly Lazy<(RunResult Run, string Folder)> Shared = new(() =>
    {
        string folder = Path.Combine(Path.GetTempPath(), "mppt-arena-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        var yaml = TestScenarios.Yaml(
            environment: "irradiance_w_m2:\n    - start: 900\n    - hold_s: 1\n    - step: 500\n    - hold_s: 1\n  cell_temperature_c: 30",
            trackers: "- { name: po, type: perturb_observe, period_ms: 10 }\n- { name: cv, type: constant_voltage, period_ms: 10 }",
            simulation: "duration_s: 2\n  plant_step_us: 100",
            extra: "scoring:\n  curve_snapshots_s: [0.5, 1.5]");
        var run = TestScenarios.Run(yaml, spec => new CsvSeriesSink(Path.Combine(folder, ResultsWriter.SeriesFileName(spec.Name))));
        ResultsWriter.Write(folder, run);
        return (run, folder);
    });

    [Fact]
    public void SummaryJsonRoundTripsThroughItsSchema()
    {
        var summary = SummaryBuilder.Build(Shared.Value.Run);
        string text = SummaryJson.Serialize(summary);
        var back = SummaryJson.Deserialize(text, "x.json");
        Assert.Equal(text, SummaryJson.Serialize(back));
        Assert.Equal(RunSummary.SchemaId, back.Schema);
        Assert.Contains("\"tracking_efficiency\"", text);
        // Every key the catalogue promises is present for a tracker that ran.
        foreach (var info in ScoreCatalog.All) Assert.True(back.Trackers[0].Scores.ContainsKey(info.Key), info.Key);
    }

    [Fact]
    public void SummaryOfAnotherSchemaIsRefused()
    {
        string text = SummaryJson.Serialize(SummaryBuilder.Build(Shared.Value.Run)).Replace(RunSummary.SchemaId, "mppt-arena/summary/999");
        var e = Assert.Throws<ArenaInputException>(() => SummaryJson.Deserialize(text, "old.json"));
        Assert.Contains("not supported", e.Message);
    }

    private static RunSummary WithEfficiency(RunSummary s, string tracker, double delta)
    {
        var trackers = s.Trackers.Select(t =>
        {
            if (t.Name != tracker) return t;
            var scores = new SortedDictionary<string, double?>(t.Scores, StringComparer.Ordinal);
            scores["tracking_efficiency"] = scores["tracking_efficiency"]!.Value + delta;
            return t with { Scores = scores };
        }).ToList();
        return s with { Trackers = trackers };
    }

    [Fact]
    public void CompareFlagsAnInjectedRegressionAndIgnoresNoiseInsideTolerance()
    {
        var baseline = SummaryBuilder.Build(Shared.Value.Run);
        var tolerances = new ToleranceSet();
        tolerances.Set("tracking_efficiency", new Tolerance(0.002, 0));
        var noisy = SummaryComparer.Compare(baseline, WithEfficiency(baseline, "po", -0.001), tolerances);
        Assert.DoesNotContain(noisy, c => c.IsRegression);
        var worse = SummaryComparer.Compare(baseline, WithEfficiency(baseline, "po", -0.01), tolerances);
        var r = Assert.Single(worse, c => c.IsRegression);
        Assert.Equal(("po", "tracking_efficiency"), (r.Tracker, r.Score));
        var better = SummaryComparer.Compare(baseline, WithEfficiency(baseline, "cv", +0.01), tolerances);
        Assert.Contains(better, c => c.Verdict == ScoreVerdict.Improved && c.Tracker == "cv");
    }

    private static RunSummary WithTracker(RunSummary s, string tracker, Func<TrackerSummary, TrackerSummary?> change) =>
        s with { Trackers = s.Trackers.Select(t => t.Name == tracker ? change(t) : t).OfType<TrackerSummary>().ToList() };

    [Fact]
    public void CompareLeavesNoHoleForARegressionToSlipThrough()
    {
        // Rules of the regression gate (common practice for CI gates: anything that got worse or stopped being
        // measurable fails): an efficiency that became undefined, a tracker that failed in both runs, a tracker
        // missing from the current run.
        var baseline = SummaryBuilder.Build(Shared.Value.Run);
        var tolerances = new ToleranceSet();
        var undefined = WithTracker(baseline, "po", t => t with { Scores = new SortedDictionary<string, double?>(t.Scores, StringComparer.Ordinal) { ["tracking_efficiency"] = null } });
        var r = Assert.Single(SummaryComparer.Compare(baseline, undefined, tolerances), c => c.IsRegression);
        Assert.Equal((ScoreVerdict.Regressed, "tracking_efficiency"), (r.Verdict, r.Score));

        var failed = WithTracker(baseline, "po", t => t with { Failed = true, FailureReason = "threw InvalidOperationException" });
        var both = SummaryComparer.Compare(failed, failed, tolerances);
        var f = Assert.Single(both, c => c.IsRegression);
        Assert.Equal(ScoreVerdict.Failing, f.Verdict);
        Assert.Contains("failed in the baseline and fails in current", f.Note);

        var gone = SummaryComparer.Compare(baseline, WithTracker(baseline, "po", _ => null), tolerances);
        var m = Assert.Single(gone, c => c.IsRegression);
        Assert.Equal((ScoreVerdict.Missing, "missing in current"), (m.Verdict, m.Note![^18..]));
    }

    [Fact]
    public void SummariesWithDuplicateTrackersOrWrongTypesAreRefusedInWords()
    {
        var baseline = SummaryBuilder.Build(Shared.Value.Run);
        string twice = SummaryJson.Serialize(baseline with { Trackers = [.. baseline.Trackers, baseline.Trackers[0]] });
        var e = Assert.Throws<ArenaInputException>(() => SummaryJson.Deserialize(twice, "twice.json"));
        Assert.Contains($"tracker name '{baseline.Trackers[0].Name}' appears 2 times", e.Message);

        string text = SummaryJson.Serialize(baseline);
        int at = text.IndexOf("\"tracking_efficiency\": ", StringComparison.Ordinal) + "\"tracking_efficiency\": ".Length;
        string wrong = text[..at] + "\"high\"" + text[text.IndexOf(',', at)..];
        var w = Assert.Throws<ArenaInputException>(() => SummaryJson.Deserialize(wrong, "wrong.json"));
        Assert.Contains("a number or null", w.Message);
        Assert.DoesNotContain("System.", w.Message);
        Assert.Matches(@"wrong\.json:\d+:\d+", w.Message);
    }

    [Fact]
    public void JUnitXmlIsWellFormedAndCountsFailures()
    {
        string file = Path.Combine(Shared.Value.Folder, "junit.xml");
        JUnitWriter.Write(file, [new JUnitCase("s", "po.ran", null, "ok"), new JUnitCase("s", "po.tracking_efficiency", "below 0.99", "0.97 < 0.99 & more")]);
        var doc = XDocument.Load(file);
        Assert.Equal("testsuites", doc.Root!.Name.LocalName);
        Assert.Equal(2, doc.Descendants("testcase").Count());
        Assert.Equal("1", doc.Root.Attribute("failures")!.Value);
        Assert.Single(doc.Descendants("failure"));
        // XML 1.0 (W3C, 2008) section 4.3.3: the BOM is optional for UTF-8; readers that take it for content
        // before the declaration exist, so the file starts with the declaration itself.
        Assert.Equal((byte)'<', File.ReadAllBytes(file)[0]);
    }

    [Theory]
    [InlineData("power.png")]
    [InlineData("voltage.png")]
    [InlineData("efficiency.png")]
    [InlineData("pv-curve-0.5s.png")]
    public void PlotsAreWrittenNonEmptyAndOfTheRequestedSize(string name)
    {
        string file = Path.Combine(Shared.Value.Folder, name);
        Assert.True(File.Exists(file), name);
        var bytes = File.ReadAllBytes(file);
        Assert.True(bytes.Length > 5000);
        // PNG: 8-byte signature, then the IHDR chunk with big-endian width and height (ISO/IEC 15948).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, bytes[..4]);
        int width = (bytes[16] << 24) | (bytes[17] << 16) | (bytes[18] << 8) | bytes[19];
        int height = (bytes[20] << 24) | (bytes[21] << 16) | (bytes[22] << 8) | bytes[23];
        Assert.Equal((1200, 800), (width, height));
    }

    [Fact]
    public void SeriesCsvHasUnitsInItsHeaderAndOneRowPerInterval()
    {
        var lines = File.ReadAllLines(Path.Combine(Shared.Value.Folder, "series-po.csv"));
        Assert.Equal(CsvSeriesSink.Header, lines[0]);
        Assert.InRange(lines.Length - 1, 199, 201); // 2 s at the default 10 ms interval
    }

    [Fact]
    public void MarkdownRanksTheTrackers()
    {
        string md = File.ReadAllText(Path.Combine(Shared.Value.Folder, "summary.md"));
        Assert.Contains("| rank | tracker |", md);
        Assert.Contains("| 1 | ", md);
    }
}

public class PlotStyleTests
{
    [Fact]
    public void EachTrackerKeepsOneColourThatNoOtherTrackerAndNotTheMppMarkerUses()
    {
        // Common practice in plotting: a series keeps its colour across figures, and a highlight colour is
        // reserved for the highlighted thing.
        string[] names = ["po", "inc", "vs-inc", "focv", "scan", "cv", "a", "b", "c", "d"];
        var palette = new MpptArena.Reports.Plots.TrackerPalette(names);
        var colours = names.Select(n => palette[n]).ToList();
        Assert.Equal(names.Length, colours.Distinct().Count());
        Assert.DoesNotContain(MpptArena.Reports.Plots.TrackerPalette.Mpp, colours);
        Assert.Equal(palette["scan"], new MpptArena.Reports.Plots.TrackerPalette(names)["scan"]);
    }

    [Theory]
    [InlineData("100:160", 100, 160)]
    [InlineData(":60", 0, 60)]
    [InlineData("3000:", 3000, 3208)]
    [InlineData("3000:9999", 3000, 3208)]
    public void APlotWindowIsReadInSecondsWithOpenSides(string text, double start, double end)
    {
        var w = MpptArena.Reports.Plots.TimeWindow.Parse(text, 3208);
        Assert.Equal((start, end), (w.StartS, w.EndS));
    }

    [Theory]
    [InlineData("160:100")]
    [InlineData("5000:")]
    [InlineData("a:b")]
    [InlineData("100")]
    public void ABadPlotWindowIsBadInput(string text) =>
        Assert.Throws<ArenaInputException>(() => MpptArena.Reports.Plots.TimeWindow.Parse(text, 3208));
}
