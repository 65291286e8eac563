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
    private static (int Exit, string Out, string Err) Dispatch(params string[] args)
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

    [GeneratedRegex("it takes: (.+)$", RegexOptions.Multiline)]
    private static partial Regex TakesPattern();
}
