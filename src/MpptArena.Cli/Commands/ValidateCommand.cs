using MpptArena.Scenarios;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena validate FILE...: checks scenario files without running them.</summary>
internal static class ValidateCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "validate", ["--plugin"], []);
        if (a.Positional.Count == 0) throw new ArenaInputException("usage: mppt-arena validate SCENARIO.yaml...", "arguments");
        var registry = Plugins.Registry(a.Options("--plugin"));
        int bad = 0;
        foreach (string file in a.Positional)
        {
            try
            {
                var s = ScenarioLoader.Load(file, registry);
                Console.WriteLine($"ok    {file}: {s.Trackers.Count} trackers, {s.Simulation.DurationS} s");
            }
            catch (ArenaInputException ex)
            {
                Console.Error.WriteLine($"error {ex.Message}");
                bad++;
            }
        }
        return bad > 0 ? ExitCodes.BadInput : ExitCodes.Ok;
    }
}
