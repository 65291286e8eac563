using MpptArena.Cli.Terminal;
using MpptArena.Reports.Summary;
using MpptArena.Scenarios;
using MpptArena.Sweeps;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena validate FILE...: checks scenario, plant and sweep files without running them.</summary>
internal static class ValidateCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "validate", ["--plugin"], []);
        if (a.Positional.Count == 0) throw new ArenaInputException("usage: mppt-arena validate SCENARIO_OR_SWEEP.yaml...", "arguments");
        var registry = Plugins.Registry(a.Options("--plugin"));
        int bad = 0;
        foreach (string file in a.Positional)
        {
            try
            {
                if (File.Exists(file) && File.ReadLines(file).Any(l => l.StartsWith("conditions:", StringComparison.Ordinal)))
                {
                    var (name, array, _) = ScenarioLoader.LoadCurveSetup(file, 0);
                    StandardOutput.Out.WriteLine($"ok    {file}: plant file '{name}' for the curve command, {array.Layout.SubstringCount} substrings");
                    continue;
                }
                if (File.Exists(file) && File.ReadLines(file).Any(l => l.StartsWith("scenarios:", StringComparison.Ordinal)))
                {
                    var sweep = SweepLoader.Load(file, registry, ScoreCatalog.All.Select(k => k.Key).ToList());
                    foreach (string w in sweep.Scenarios.SelectMany(x => x.Warnings).Distinct()) StandardOutput.Error.WriteLine($"warning {w}");
                    StandardOutput.Out.WriteLine($"ok    {file}: sweep '{sweep.Name}', {SweepPlanner.Cases(sweep).Count} cases over {sweep.Scenarios.Count} scenario(s)");
                    continue;
                }
                var s = ScenarioLoader.Load(file, registry);
                StandardOutput.Out.WriteLine(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"ok    {file}: scenario '{s.Name}', {s.Trackers.Count} trackers, {s.Simulation.DurationS:G6} s simulated, module ideality factor {s.Array.Module.IdealityFactor:0.000}"));
                foreach (string w in s.Warnings) StandardOutput.Error.WriteLine($"warning {w}");
            }
            catch (ArenaInputException ex)
            {
                StandardOutput.Error.WriteLine($"error {ex.Message}");
                bad++;
            }
        }
        return bad > 0 ? ExitCodes.BadInput : ExitCodes.Ok;
    }
}
