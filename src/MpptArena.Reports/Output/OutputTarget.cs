namespace MpptArena.Reports.Output;

/// <summary>
/// The rules for a folder the user names with --out: the arena writes into a folder that does not exist
/// or is empty, replaces one only when it wrote it itself (<see cref="OutputMarker"/>) and the user said
/// --force, and refuses everything else before any work starts.
/// </summary>
public static class OutputTarget
{
    /// <summary>Checks <paramref name="path"/> as an output folder; throws <see cref="ArenaInputException"/> when it may not be written.</summary>
    /// <param name="path">The folder, as given.</param>
    /// <param name="force">Whether the user allowed replacing an earlier arena output.</param>
    /// <param name="option">The option that named it, for the message.</param>
    public static OutputTargetState Check(string path, bool force, string option = "--out")
    {
        string full = FullPath(path, option);
        if (File.Exists(full)) throw new ArenaInputException($"{option} '{path}' is a file; name a folder", option);
        if (!Directory.Exists(full)) return OutputTargetState.Absent;
        if (new DirectoryInfo(full).LinkTarget is not null)
        {
            throw new ArenaInputException($"{option} '{path}' is a symbolic link; name the folder itself", option);
        }
        string cwd = Path.TrimEndingDirectorySeparator(Path.GetFullPath(Directory.GetCurrentDirectory()));
        if (IsSameOrInside(cwd, full))
        {
            throw new ArenaInputException($"{option} '{path}' is the current folder or holds it; the arena does not write into a folder you are working in (name a new folder, e.g. {option} results/my-run)", option);
        }
        if (!Directory.EnumerateFileSystemEntries(full).Any()) return OutputTargetState.Empty;
        var marker = OutputMarker.Read(full);
        if (marker is null)
        {
            throw new ArenaInputException($"{option} '{path}' is a folder with files the arena did not write; it is never emptied or overwritten: name a new or empty folder", option);
        }
        string? foreign = marker.FirstForeignEntry(full);
        if (foreign is not null)
        {
            throw new ArenaInputException($"{option} '{path}' holds an earlier {marker.Kind} result and also '{foreign}', which the arena did not write; it is not replaced: name a new folder or move that file out", option);
        }
        if (!force)
        {
            throw new ArenaInputException($"{option} '{path}' holds an earlier {marker.Kind} result (tool {marker.ToolVersion}); add --force to replace it, or name a new folder", option);
        }
        return OutputTargetState.ArenaOutput;
    }

    /// <summary>The absolute form of a folder named by an option; refuses an empty name and a file-system root.</summary>
    public static string FullPath(string path, string option = "--out")
    {
        if (string.IsNullOrWhiteSpace(path)) throw new ArenaInputException($"{option} needs a folder name; it was empty", option);
        string full;
        try
        {
            full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(path));
        }
        catch (Exception ex) when (ex is ArgumentException or NotSupportedException or PathTooLongException)
        {
            throw new ArenaInputException($"{option} '{path}' is not a usable path: {ex.Message}", option);
        }
        if (Path.GetPathRoot(full) is { } root && Path.TrimEndingDirectorySeparator(root) == full)
        {
            throw new ArenaInputException($"{option} '{path}' is the root of a file system; name a folder for the results", option);
        }
        return full;
    }

    /// <summary>True when <paramref name="inner"/> is <paramref name="outer"/> or a folder inside it (absolute, trimmed paths).</summary>
    public static bool IsSameOrInside(string inner, string outer)
    {
        var cmp = OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
        return inner.Equals(outer, cmp) || inner.StartsWith(outer + Path.DirectorySeparatorChar, cmp);
    }
}
