namespace MpptArena.Tests;

/// <summary>The repository root, found from the test assembly's folder.</summary>
internal static class RepoRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "MpptArena.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("MpptArena.sln not found above " + AppContext.BaseDirectory);
    }
}
