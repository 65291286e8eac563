using System.Diagnostics;

namespace MpptArena.Tests.Plugins;

/// <summary>Compiles small C sources into shared libraries at test time with the machine's cc.</summary>
internal static class CCompiler
{
    public static string HeaderDirectory => Path.Combine(RepoRoot.Path, "src", "MpptArena", "Trackers", "Native");

    public static string Folder()
    {
        string d = Path.Combine(Path.GetTempPath(), "mppt-arena-native", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(d);
        return d;
    }

    /// <summary>Runs a program and returns its exit code and combined output.</summary>
    public static (int Exit, string Output) Run(string file, params string[] args) => RunIn(null, file, args);

    /// <summary>
    /// Runs a program in <paramref name="workingDirectory"/> (null: this process's) and returns its exit code
    /// and its standard output followed by its standard error (read concurrently, so neither can fill up and block).
    /// </summary>
    public static (int Exit, string Output) RunIn(string? workingDirectory, string file, params string[] args)
    {
        var psi = new ProcessStartInfo(file) { RedirectStandardOutput = true, RedirectStandardError = true };
        if (workingDirectory is not null) psi.WorkingDirectory = workingDirectory;
        foreach (string a in args) psi.ArgumentList.Add(a);
        psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        psi.Environment["DOTNET_NOLOGO"] = "1";
        Process p;
        try
        {
            p = Process.Start(psi)!;
        }
        catch (System.ComponentModel.Win32Exception ex)
        {
            throw new InvalidOperationException($"'{file}' could not be started ({ex.Message}); the native tracker tests need a C compiler on the PATH (cc, gcc or clang)");
        }
        using (p)
        {
            var error = p.StandardError.ReadToEndAsync();
            string output = p.StandardOutput.ReadToEnd();
            p.WaitForExit();
            return (p.ExitCode, output + error.Result);
        }
    }

    /// <summary>Compiles <paramref name="source"/> into a shared library in <paramref name="folder"/>.</summary>
    public static string SharedLibrary(string folder, string name, string source)
    {
        string c = Path.Combine(folder, name + ".c");
        File.WriteAllText(c, source);
        string lib = Path.Combine(folder, OperatingSystem.IsMacOS() ? $"lib{name}.dylib" : $"lib{name}.so");
        var (exit, output) = Run("cc", "-std=c99", "-O1", "-shared", "-fPIC", "-I" + HeaderDirectory, "-o", lib, c, "-lm");
        Assert.True(exit == 0, $"cc failed: {output}");
        return lib;
    }
}
