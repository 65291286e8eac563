using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Tests.Scenarios;

public class CsvProfileTests
{
    private static string Write(string content, string options = "")
    {
        string dir = Path.Combine(Path.GetTempPath(), "mppt-arena-csv", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "measured.csv"), content);
        string yaml = TestScenarios.Yaml(environment: "irradiance_w_m2:\n    - start: 500\n    - hold_s: 1\n    - csv: { file: measured.csv" + options + " }\n  cell_temperature_c: 25",
            simulation: "duration_s: 5\n  plant_step_us: 100");
        string file = Path.Combine(dir, "s.yaml");
        File.WriteAllText(file, yaml);
        return file;
    }

    [Fact]
    public void MeasuredSeriesIsImportedAndInterpolatedFromWhereTheProfileStands()
    {
        var s = ScenarioLoader.Load(Write("time_s,irradiance_w_m2\n0,600\n2,800\n# a comment\n3,700\n", ", hold_last: true"), TrackerRegistry.WithBuiltIns());
        var p = s.Environment.Irradiance;
        Assert.Equal(500, p.ValueAt(0.5));
        Assert.Equal(700, p.ValueAt(2.0), 9); // halfway between (1 s, 600) and (3 s, 800)
        Assert.Equal(700, p.ValueAt(10.0));
    }

    [Fact]
    public void BadCsvRowIsReportedWithItsLineAndColumn()
    {
        var e = Assert.Throws<ArenaInputException>(() => ScenarioLoader.Load(Write("t,g\n0,600\n1,bright\n"), TrackerRegistry.WithBuiltIns()));
        Assert.Equal(3, e.Location!.Line);
        Assert.Equal(3, e.Location.Column);
        Assert.Contains("'bright' is not a number", e.Message);
        var back = Assert.Throws<ArenaInputException>(() => ScenarioLoader.Load(Write("t,g\n0,600\n2,700\n1,650\n"), TrackerRegistry.WithBuiltIns()));
        Assert.Contains("time goes backwards", back.Message);
        Assert.Equal(4, back.Location!.Line);
    }

    [Fact]
    public void QuotedNumbersAreReadAndAFileThatEndsBeforeTheRunIsRefused()
    {
        // Spreadsheets and loggers quote numbers ("600"); RFC 4180 (Shafranovich, 2005) doubles a quote inside one.
        var s = ScenarioLoader.Load(Write("\"t\",\"g\"\n\"0\",\"600\"\n\"4\", \"800\"\n"), TrackerRegistry.WithBuiltIns());
        Assert.Equal(700, s.Environment.Irradiance.ValueAt(3.0), 9);
        var shortFile = Assert.Throws<ArenaInputException>(() => ScenarioLoader.Load(Write("t,g\n0,600\n2,800\n"), TrackerRegistry.WithBuiltIns()));
        Assert.Contains("stop at 3 s, before the run's 5 s", shortFile.Message);
        Assert.Contains("hold_last", shortFile.Message);
        var sameColumn = Assert.Throws<ArenaInputException>(() => ScenarioLoader.Load(Write("t,g\n0,600\n4,800\n", ", value_column: 1"), TrackerRegistry.WithBuiltIns()));
        Assert.Contains("both column 1", sameColumn.Message);
        Assert.NotNull(sameColumn.Location);
    }
}
