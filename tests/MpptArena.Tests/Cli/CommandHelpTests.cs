using System.Globalization;
using System.Text.RegularExpressions;
using MpptArena.Cli;
using MpptArena.Cli.Commands;
using MpptArena.Cli.Terminal;
using MpptArena.Reports.Summary;

namespace MpptArena.Tests.Cli;

/// <summary>The help a user reads agrees with what the tool does (rules of the tool itself).</summary>
public partial class CommandHelpTests
{
    internal static (int Exit, string Out, string Err) Dispatch(params string[] args)
    {
        var (output, error) = (new StringWriter(), new StringWriter());
        using (StandardOutput.RedirectTo(output, error)) return (Program.Dispatch(args), output.ToString(), error.ToString());
    }

    [Fact]
    public void EveryCommandHasHelpListingExactlyTheOptionsItTakes()
    {
        foreach (var help in CommandHelp.All)
        {
            var (exit, text, _) = Dispatch(help.Name, "--help");
            Assert.Equal(0, exit);
            Assert.StartsWith($"usage: mppt-arena {help.Name}", text);
            Assert.Contains("example:", text);
            Assert.Equal(text, Dispatch("help", help.Name).Out);
            // The command's own list of what it takes, from its refusal of an unknown option.
            var (refused, _, err) = Dispatch(help.Name, "--no-such-option");
            Assert.Equal(2, refused);
            var takes = TakesPattern().Match(err);
            Assert.True(takes.Success, err);
            var accepted = takes.Groups[1].Value.Split(", ").Order(StringComparer.Ordinal).ToList();
            var documented = help.Options.Select(o => o.Option.Split(' ')[0]).Order(StringComparer.Ordinal).ToList();
            Assert.Equal(accepted, documented);
        }
        Assert.Equal(2, Dispatch("help", "fly").Exit);
    }

    [Fact]
    public void TheReadmeTableOfDefaultTolerancesIsTheCatalogues()
    {
        string readme = File.ReadAllText(Path.Combine(RepoRoot.Path, "README.md"));
        foreach (var score in ScoreCatalog.All)
        {
            var row = Regex.Match(readme, $@"^\| `{score.Key}` \| [^|]+ \| ([0-9.e-]+)[^|]* \| ([0-9.e-]+) \|$", RegexOptions.Multiline);
            Assert.True(row.Success, $"README has no tolerance row for {score.Key}");
            Assert.Equal(score.DefaultAbsoluteTolerance, double.Parse(row.Groups[1].Value, CultureInfo.InvariantCulture));
            Assert.Equal(score.DefaultRelativeTolerance, double.Parse(row.Groups[2].Value, CultureInfo.InvariantCulture));
        }
    }

    [Fact]
    public void ExplainShowsTheFittedModuleTheArrayAtStcAndTheSensorResolution()
    {
        // The De Soto fit passes through the datasheet's (0, Isc), (Voc, 0) and (Vmp, Imp) (De Soto, Klein,
        // Beckman, Solar Energy 80, 2006), so the fitted module at STC reproduces the bundled sheet; ten in
        // series give ten times its voltage; an ADC's LSB is full scale / 2^bits (500 V / 4096 = 0.12207 V).
        var (exit, text, _) = Dispatch("explain", Path.Combine(RepoRoot.Path, "scenarios", "demo-moving-shadow.yaml"));
        Assert.Equal(0, exit);
        Assert.Contains("stc: { voc_v: 38.2, isc_a: 9.5, vmp_v: 31, imp_a: 8.95, pmp_w: 277.45 }", text);
        Assert.Contains("stc: { voc_v: 382, isc_a: 9.5, vmp_v: 310, imp_a: 8.95, pmp_w: 2774.5 }", text);
        Assert.Contains("lsb_v: 0.12207,", text);
        Assert.Contains("ideality_factor_per_cell: 1.01856", text);
        Assert.Contains("plant_step_us: 1000   # chosen", text);
        Assert.Contains("reachable_pv_voltage_v: { from: 35, to: 700 }", text); // (1 - 0.95) x 700 V to 700 V
    }

    [GeneratedRegex("it takes: (.+)$", RegexOptions.Multiline)]
    private static partial Regex TakesPattern();
}
