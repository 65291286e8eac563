using MpptArena.Tests.Cli;

namespace MpptArena.Tests.Plugins;

public class ScaffoldTests
{
    [Fact]
    public void ScaffoldedTrackerProjectBuildsPassesItsTestAndScores()
    {
        string root = CliProcess.TempFolder();
        string folder = Path.Combine(root, "hill");
        var made = CliProcess.Run(root, "new-tracker", "my-hill", "--out", folder);
        Assert.True(made.Exit == 0, made.Err);
        var test = CCompiler.Run("dotnet", "test", Path.Combine(folder, "tests"), "-c", "Release", "--nologo");
        Assert.True(test.Exit == 0, test.Output);
        Assert.Contains("Passed!", test.Output);
        var run = CliProcess.Run(folder, "run", "scenario.yaml", "--out", "out", "--no-plots");
        Assert.True(run.Exit == 0, run.Err + run.Out);
        var summary = MpptArena.Reports.Summary.SummaryJson.Read(Path.Combine(folder, "out"));
        Assert.Equal("my_hill", summary.Trackers[0].Kind);
        Assert.True(summary.Trackers[0].Scores["tracking_efficiency"] > 0.95);
        var again = CliProcess.Run(root, "new-tracker", "my-hill", "--out", folder);
        Assert.Equal(2, again.Exit);
    }
}
