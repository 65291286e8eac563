namespace MpptArena.Trackers.Isolation;

/// <summary>Names how a host process ended, as a firmware developer reads it.</summary>
public static class ExitDescription
{
    private static readonly Dictionary<int, string> Signals = new()
    {
        [1] = "SIGHUP", [2] = "SIGINT", [3] = "SIGQUIT", [4] = "SIGILL", [5] = "SIGTRAP", [6] = "SIGABRT", [7] = "SIGBUS",
        [8] = "SIGFPE", [9] = "SIGKILL", [11] = "SIGSEGV", [13] = "SIGPIPE", [14] = "SIGALRM", [15] = "SIGTERM", [24] = "SIGXCPU", [31] = "SIGSYS",
    };

    /// <summary>"exited with code 0" or, on Unix where .NET reports a signal as 128 + its number, "killed by SIGSEGV".</summary>
    /// <param name="exitCode">The process's exit code as <see cref="System.Diagnostics.Process.ExitCode"/> reports it.</param>
    public static string Of(int exitCode)
    {
        if (!OperatingSystem.IsWindows() && exitCode > 128 && exitCode < 128 + 65)
        {
            int signal = exitCode - 128;
            return Signals.TryGetValue(signal, out string? name) ? $"killed by {name}" : $"killed by signal {signal}";
        }
        if (OperatingSystem.IsWindows() && exitCode == unchecked((int)0xC0000005)) return "crashed with an access violation (0xC0000005)";
        if (OperatingSystem.IsWindows() && exitCode == unchecked((int)0xC00000FD)) return "crashed with a stack overflow (0xC00000FD)";
        return $"exited with code {exitCode}";
    }
}
