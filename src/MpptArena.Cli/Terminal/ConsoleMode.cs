namespace MpptArena.Cli.Terminal;

/// <summary>Whether to draw progress bars: only on an interactive terminal, never in CI.</summary>
internal static class ConsoleMode
{
    /// <summary>True when stdout is a terminal and no CI variable is set.</summary>
    public static bool Interactive =>
        !Console.IsOutputRedirected && string.IsNullOrEmpty(System.Environment.GetEnvironmentVariable("CI"));
}
