namespace MpptArena.Cli.Terminal;

/// <summary>A path as the tool prints it: relative to the folder the user runs it in.</summary>
internal static class ShownPath
{
    /// <summary><paramref name="path"/> relative to the current folder.</summary>
    public static string Of(string path) => Path.GetRelativePath(Directory.GetCurrentDirectory(), path);
}
