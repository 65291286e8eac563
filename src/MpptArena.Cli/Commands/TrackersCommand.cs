using MpptArena.Cli.Terminal;
using System.Globalization;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena trackers: the tracker kinds and their declared parameters.</summary>
internal static class TrackersCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "trackers", ["--plugin"], []);
        var registry = Plugins.Registry(a.Options("--plugin"));
        var c = CultureInfo.InvariantCulture;
        foreach (var d in registry.All)
        {
            // Plain lines, one per item: piped into grep or a file they must not wrap at a terminal width.
            StandardOutput.Out.WriteLine($"{d.Kind}: {d.Summary}");
            if (d.Source.Length > 0) StandardOutput.Out.WriteLine($"  source: {d.Source}");
            foreach (var p in d.Parameters)
            {
                StandardOutput.Out.WriteLine($"  {p.Name} [{p.Unit}] default {p.Default.ToString("G6", c)}, range {p.Min.ToString("G6", c)} to {p.Max.ToString("G6", c)}: {p.Description}");
            }
        }
        return ExitCodes.Ok;
    }
}
