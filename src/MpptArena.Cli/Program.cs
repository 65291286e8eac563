using MpptArena.Cli.Terminal;
using MpptArena.Cli.Commands;

namespace MpptArena.Cli;

/// <summary>The mppt-arena command: parse, call the library, print.</summary>
internal static class Program
{
    private const string Help = """
        mppt-arena: score maximum-power-point trackers against a simulated PV array.

        commands:
          run SCENARIO.yaml        run every tracker of a scenario; write a results folder
          curve FILE.yaml          I-V and P-V curves and every MPP of a plant (or a scenario at --at SECONDS)
          compare BASELINE CURRENT compare two summaries (files or results folders); exit 1 on regression
          trackers                 list tracker kinds and their parameters
          validate FILE.yaml...    check scenario, plant and sweep files without running them
          explain SCENARIO.yaml    the scenario as it will run: every default, the fitted module, the array
                                   at STC, the converter's PV-voltage window, sensor LSBs, the plant step
          new-tracker NAME         scaffold a C# tracker project (--out DIR)
          sweep SWEEP.yaml         run a parameter sweep (with --shard K/N for one part of it)
          merge SHARD_DIR...       join sweep shards into one result
          help COMMAND             a command's options, defaults and an example (or COMMAND --help)

        results go to a new or empty --out folder; an earlier result of the arena is replaced only with
          --force, and a folder with anything else in it never is

        exit codes: 0 ok (a complete result and every gate passed), 1 a gate failed (threshold, regression,
          or a tracker that failed, however it failed), 2 bad input, 3 internal error,
          130 interrupted by SIGINT, 143 stopped by SIGTERM
        """;

    public static int Main(string[] args)
    {
        StandardOutput.Capture();
        return Dispatch(args);
    }

    /// <summary>Runs one command and turns every way it can end into an exit code and a message (never a stack trace).</summary>
    internal static int Dispatch(string[] args)
    {
        if (args.Length == 0 || args[0] is "-h" or "--help" || (args[0] == "help" && args.Length == 1))
        {
            StandardOutput.Out.WriteLine(Help);
            return args.Length == 0 ? ExitCodes.BadInput : ExitCodes.Ok;
        }
        string[] rest = args[1..];
        // "mppt-arena help run" and "mppt-arena run --help" print the command's own help.
        string? helpFor = args[0] == "help" ? args[1] : rest.Any(r => r is "--help" or "-h") ? args[0] : null;
        if (helpFor is not null)
        {
            if (CommandHelp.For(helpFor) is not { } help)
            {
                StandardOutput.Error.WriteLine($"error: unknown command '{helpFor}'; run 'mppt-arena help' for the list");
                return ExitCodes.BadInput;
            }
            StandardOutput.Out.Write(help.Render());
            return ExitCodes.Ok;
        }
        try
        {
            return args[0] switch
            {
                "run" => RunCommand.Execute(rest),
                "curve" => CurveCommand.Execute(rest),
                "compare" => CompareCommand.Execute(rest),
                "trackers" => TrackersCommand.Execute(rest),
                "validate" => ValidateCommand.Execute(rest),
                "explain" => ExplainCommand.Execute(rest),
                "new-tracker" => NewTrackerCommand.Execute(rest),
                "sweep" => SweepCommand.Execute(rest),
                "merge" => MergeCommand.Execute(rest),
                "procedure" => ProcedureCommand.Execute(rest),
                "--version" => Version(),
                _ => throw new ArenaInputException($"unknown command '{args[0]}'; run 'mppt-arena --help' for the list", "command"),
            };
        }
        catch (OperationCanceledException)
        {
            // The command that was interrupted has said what it kept; only the exit code is left to give.
            return ExitCodes.Interrupted;
        }
        catch (ArenaInputException ex)
        {
            StandardOutput.Error.WriteLine($"error: {ex.Message}");
            return ExitCodes.BadInput;
        }
        catch (AggregateException ex) when (ex.Flatten().InnerExceptions is [ArenaInputException first, ..] inner && inner.All(e => e is ArenaInputException))
        {
            // Work done in parallel (sweep cases) met bad input: report it as such, once.
            StandardOutput.Error.WriteLine($"error: {first.Message}");
            return ExitCodes.BadInput;
        }
        catch (Exception ex) when (System.Environment.GetEnvironmentVariable("MPPT_ARENA_DEBUG") is null)
        {
            StandardOutput.Error.WriteLine($"internal error: {ex.GetType().Name}: {ex.Message} (set MPPT_ARENA_DEBUG=1 for details, and please report it)");
            return ExitCodes.InternalError;
        }
    }

    private static int Version()
    {
        StandardOutput.Out.WriteLine(MpptArena.Reports.Summary.SummaryBuilder.ToolVersion);
        return ExitCodes.Ok;
    }
}
