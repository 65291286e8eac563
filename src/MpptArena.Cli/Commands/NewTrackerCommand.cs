using MpptArena.Cli.Terminal;
using MpptArena.Cli.Scaffolding;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena new-tracker NAME [--out DIR] [--feed SOURCE]: scaffolds a C# tracker project that builds and scores out of the box.</summary>
internal static class NewTrackerCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "new-tracker", ["--out", "--feed"], []);
        a.RequirePositional(1, "mppt-arena new-tracker NAME [--out DIR] [--feed FOLDER-OR-URL]");
        string name = a.Positional[0];
        string folder = a.Option("--out") ?? name;
        var files = TrackerScaffold.Write(name, folder, a.Option("--feed"));
        foreach (string f in files) StandardOutput.Out.WriteLine($"wrote {f}");
        StandardOutput.Out.WriteLine($"next: cd {folder} && dotnet test tests && dotnet build src -c Release && mppt-arena run scenario.yaml");
        return ExitCodes.Ok;
    }
}
