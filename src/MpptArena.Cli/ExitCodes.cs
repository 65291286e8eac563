namespace MpptArena.Cli;

/// <summary>Process exit codes.</summary>
internal static class ExitCodes
{
    /// <summary>Success; no gate failed.</summary>
    public const int Ok = 0;

    /// <summary>A gate failed: a score below its threshold, a regression, a failed tracker.</summary>
    public const int GateFailed = 1;

    /// <summary>Bad input: a file, an option, a value.</summary>
    public const int BadInput = 2;

    /// <summary>A fault of the tool itself.</summary>
    public const int InternalError = 3;

    /// <summary>Interrupted by SIGINT (Ctrl+C): 128 + 2.</summary>
    public const int Interrupted = 130;

    /// <summary>Stopped by SIGTERM: 128 + 15.</summary>
    public const int Terminated = 143;
}
