using Spectre.Console;

namespace MpptArena.Cli.Terminal;

/// <summary>
/// The arena's own standard output and error, taken before any tracker code is loaded: a plug-in that writes
/// to or replaces Console.Out cannot garble or hide the tool's tables and messages.
/// </summary>
internal static class StandardOutput
{
    /// <summary>Standard output as it was at start-up.</summary>
    public static TextWriter Out { get; private set; } = Console.Out;

    /// <summary>Standard error as it was at start-up.</summary>
    public static TextWriter Error { get; private set; } = Console.Error;

    /// <summary>Takes the streams and points Spectre.Console at them.</summary>
    public static void Capture()
    {
        Out = Console.Out;
        Error = Console.Error;
        AnsiConsole.Console = AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(Out) });
    }
}
