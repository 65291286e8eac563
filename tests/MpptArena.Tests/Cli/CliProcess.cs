using System.Diagnostics;

namespace MpptArena.Tests.Cli;

/// <summary>Runs the mppt-arena program as a separate process, as a user or a CI job would.</summary>
internal static class CliProcess
{
    public static (int Exit, string Out, string Err) Run(string workingDirectory, params string[] args)
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "mppt-arena.dll");
        var psi = new ProcessStartInfo("dotnet") { WorkingDirectory = workingDirectory, RedirectStandardOutput = true, RedirectStandardError = true };
        psi.ArgumentList.Add(dll);
        foreach (string a in args) psi.ArgumentList.Add(a);
        psi.Environment["CI"] = "true";
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(300_000))
        {
            p.Kill(true);
            throw new TimeoutException("mppt-arena did not finish in 5 minutes: " + string.Join(' ', args));
        }
        return (p.ExitCode, stdout.Result, stderr.Result);
    }

    public static string TempFolder()
    {
        string d = Path.Combine(Path.GetTempPath(), "mppt-arena-cli", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(d);
        return d;
    }
}
