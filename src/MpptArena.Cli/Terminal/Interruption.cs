using System.Runtime.InteropServices;

namespace MpptArena.Cli.Terminal;

/// <summary>
/// SIGINT (Ctrl+C) and SIGTERM as a cancellation: the run stops between plant steps, cleans up what it was
/// writing, says so, and the process exits with 128 + the signal's number (130, 143), never 0.
/// </summary>
internal sealed class Interruption : IDisposable
{
    private readonly CancellationTokenSource _source = new();
    private readonly List<PosixSignalRegistration> _registrations = [];

    public Interruption()
    {
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGINT, On));
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGTERM, On));
    }

    /// <summary>Cancelled when a signal arrives.</summary>
    public CancellationToken Token => _source.Token;

    /// <summary>The exit code for the signal that arrived (130 for SIGINT, 143 for SIGTERM).</summary>
    public int ExitCode { get; private set; } = ExitCodes.Interrupted;

    /// <summary>The signal's name, for messages.</summary>
    public string SignalName { get; private set; } = "SIGINT";

    private void On(PosixSignalContext context)
    {
        context.Cancel = true;
        if (context.Signal == PosixSignal.SIGTERM)
        {
            ExitCode = ExitCodes.Terminated;
            SignalName = "SIGTERM";
        }
        _source.Cancel();
    }

    public void Dispose()
    {
        foreach (var r in _registrations) r.Dispose();
        _source.Dispose();
    }
}
