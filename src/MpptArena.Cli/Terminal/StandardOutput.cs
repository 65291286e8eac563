using Spectre.Console;

namespace MpptArena.Cli.Terminal;

/// <summary>
/// The arena's own standard output and error, taken before any tracker code is loaded: a plug-in that writes
/// to or replaces Console.Out cannot garble or hide the tool's tables and messages.
/// </summary>
internal static class StandardOutput
{
    private static readonly AsyncLocal<(TextWriter Out, TextWriter Error)?> Redirected = new();
    private static TextWriter _out = Console.Out;
    private static TextWriter _error = Console.Error;

    /// <summary>Standard output as it was at start-up.</summary>
    public static TextWriter Out => Redirected.Value?.Out ?? _out;

    /// <summary>Standard error as it was at start-up.</summary>
    public static TextWriter Error => Redirected.Value?.Error ?? _error;

    /// <summary>
    /// Until the returned scope ends, what this flow of execution writes goes to the given writers (the
    /// tests run commands in process this way, each with its own writers).
    /// </summary>
    public static IDisposable RedirectTo(TextWriter output, TextWriter error)
    {
        var before = Redirected.Value;
        Redirected.Value = (output, error);
        return new Restore(() => Redirected.Value = before);
    }

    private sealed class Restore(Action restore) : IDisposable
    {
        public void Dispose() => restore();
    }

    /// <summary>Takes the streams and points Spectre.Console at them.</summary>
    public static void Capture()
    {
        _out = Console.Out;
        _error = Console.Error;
        AnsiConsole.Console = AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(Out) });
        // Piped or in a CI log there is no terminal width; Spectre.Console would assume 80 columns and wrap
        // table rows mid-line. A log line may be as long as it needs; a CI terminal gets at least 100 columns.
        if (Console.IsOutputRedirected) AnsiConsole.Profile.Width = 400;
        else if (!ConsoleMode.Interactive && AnsiConsole.Profile.Width < 100) AnsiConsole.Profile.Width = 100;
    }
}
