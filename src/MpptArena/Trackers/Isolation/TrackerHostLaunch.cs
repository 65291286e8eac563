using System.Diagnostics;

namespace MpptArena.Trackers.Isolation;

/// <summary>How to start the process that hosts a tracker, and whether one process may serve many instances in turn.</summary>
/// <param name="FileName">Executable to start.</param>
/// <param name="Arguments">Its arguments.</param>
/// <param name="WorkingDirectory">Folder it starts in.</param>
/// <param name="Reusable">
/// True for the arena's own host, which gives every instance fresh globals (a private copy of the library or
/// a fresh load context) and so may serve instance after instance; false for other executables, whose
/// process state cannot be reset, so each instance gets a new process.
/// </param>
/// <param name="Description">What it hosts, for messages ("C library libpo.so").</param>
public sealed record TrackerHostLaunch(string FileName, IReadOnlyList<string> Arguments, string WorkingDirectory, bool Reusable, string Description)
{
    /// <summary>Identity for pooling: two launches with the same key start interchangeable processes.</summary>
    public string Key => string.Join("\u0001", [FileName, WorkingDirectory, .. Arguments]);

    /// <summary>The arena's host for a C tracker library (one private copy of the library per instance).</summary>
    public static TrackerHostLaunch ForNativeLibrary(string libraryPath) =>
        ArenaHost(["native", Path.GetFullPath(libraryPath)], $"C library {Path.GetFileName(libraryPath)}");

    /// <summary>The arena's host for a tracker kind of a .NET plug-in assembly (one fresh load context per instance).</summary>
    public static TrackerHostLaunch ForPlugin(string assemblyPath, string kind) =>
        ArenaHost(["plugin", Path.GetFullPath(assemblyPath), kind], $"plug-in {Path.GetFileName(assemblyPath)} ({kind})");

    /// <summary>Any executable that speaks the protocol on its standard streams, started in <paramref name="workingDirectory"/>.</summary>
    public static TrackerHostLaunch ForCommand(IReadOnlyList<string> command, string workingDirectory)
    {
        if (command.Count == 0) throw new ArgumentException("empty command", nameof(command));
        return new TrackerHostLaunch(command[0], command.Skip(1).ToList(), Path.GetFullPath(workingDirectory), false, $"command '{string.Join(' ', command)}'");
    }

    /// <summary>Path of the host assembly: MPPT_ARENA_HOST if set, else mppt-arena-host.dll beside this library.</summary>
    public static string HostAssemblyPath =>
        System.Environment.GetEnvironmentVariable("MPPT_ARENA_HOST") is { Length: > 0 } given
            ? Path.GetFullPath(given)
            : Path.Combine(Path.GetDirectoryName(typeof(TrackerHostLaunch).Assembly.Location) ?? AppContext.BaseDirectory, "mppt-arena-host.dll");

    private static TrackerHostLaunch ArenaHost(string[] arguments, string description)
    {
        string host = HostAssemblyPath;
        if (!File.Exists(host))
        {
            throw new ArenaInputException($"the tracker host '{host}' is missing, so {description} cannot run isolated; reinstall mppt-arena, or set 'isolation: in_process' on the tracker to run it inside the arena", "isolation");
        }
        return new TrackerHostLaunch(DotnetExecutable(), [host, .. arguments], Path.GetDirectoryName(host)!, true, description);
    }

    /// <summary>The dotnet executable running this process, or the one on the PATH.</summary>
    private static string DotnetExecutable()
    {
        string? self = System.Environment.ProcessPath;
        if (self is not null && Path.GetFileNameWithoutExtension(self).Equals("dotnet", StringComparison.OrdinalIgnoreCase)) return self;
        if (System.Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } hostPath && File.Exists(hostPath)) return hostPath;
        if (System.Environment.GetEnvironmentVariable("DOTNET_ROOT") is { Length: > 0 } root)
        {
            string candidate = Path.Combine(root, OperatingSystem.IsWindows() ? "dotnet.exe" : "dotnet");
            if (File.Exists(candidate)) return candidate;
        }
        return "dotnet";
    }

    /// <summary>Process start information with all three standard streams redirected.</summary>
    internal ProcessStartInfo StartInfo(TrackerLimits limits)
    {
        var psi = new ProcessStartInfo(FileName)
        {
            WorkingDirectory = WorkingDirectory,
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            CreateNoWindow = true,
        };
        foreach (string a in Arguments) psi.ArgumentList.Add(a);
        if (Reusable)
        {
            // A managed plug-in that allocates without bound meets an OutOfMemoryException (a reported failure)
            // before the resident-memory watch has to kill the host.
            psi.Environment["DOTNET_GCHeapHardLimit"] = "0x" + limits.MemoryBytes.ToString("X");
            psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        }
        return psi;
    }
}
