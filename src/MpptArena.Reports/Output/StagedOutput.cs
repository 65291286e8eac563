namespace MpptArena.Reports.Output;

/// <summary>
/// An output written in a hidden staging folder beside its target and renamed into place when it is
/// complete, so that a target folder either holds a whole result or is untouched. Disposing an
/// uncommitted stage removes it (only ever the stage: a folder this object created).
/// </summary>
public sealed class StagedOutput : IDisposable
{
    private readonly string _kind;
    private readonly bool _force;
    private readonly bool _numberIfTaken;
    private readonly string _option;
    private bool _committed;

    private StagedOutput(string target, string kind, bool force, bool numberIfTaken, string option)
    {
        _kind = kind;
        _force = force;
        _numberIfTaken = numberIfTaken;
        _option = option;
        TargetPath = OutputTarget.FullPath(target, option);
        RequestedPath = target;
        if (numberIfTaken) TargetPath = FreeName(TargetPath);
        else OutputTarget.Check(TargetPath, force, option);
        string parent = Path.GetDirectoryName(TargetPath)!;
        Directory.CreateDirectory(parent);
        StagingPath = Path.Combine(parent, $".{Path.GetFileName(TargetPath)}.staging-{System.Environment.ProcessId}-{Guid.NewGuid():N}"[..^24]);
        Directory.CreateDirectory(StagingPath);
    }

    /// <summary>The folder as the user gave it.</summary>
    public string RequestedPath { get; }

    /// <summary>Where the result will be: absolute.</summary>
    public string TargetPath { get; private set; }

    /// <summary>The hidden folder to write everything into before <see cref="Commit"/>.</summary>
    public string StagingPath { get; }

    /// <summary>
    /// Checks the target and creates the staging folder. With <paramref name="numberIfTaken"/> (a default
    /// name the user did not choose) a taken name gets "-2", "-3", ... instead of a refusal.
    /// </summary>
    public static StagedOutput Begin(string target, string kind, bool force, string option = "--out", bool numberIfTaken = false) =>
        new(target, kind, force, numberIfTaken, option);

    /// <summary>
    /// Marks the staged folder and renames it into place; returns the final folder. Throws
    /// <see cref="ArenaInputException"/> when the target was taken meanwhile by something it may not replace.
    /// </summary>
    /// <param name="ownedFolders">Sub-folders whose whole contents are the arena's (see <see cref="OutputMarker.Folders"/>).</param>
    public string Commit(IReadOnlyList<string>? ownedFolders = null)
    {
        OutputMarker.Describe(StagingPath, _kind, ownedFolders).Write(StagingPath);
        for (int attempt = 0; ; attempt++)
        {
            if (_numberIfTaken && attempt > 0) TargetPath = FreeName(TargetPath);
            var state = _numberIfTaken ? (Directory.Exists(TargetPath) ? OutputTargetState.Empty : OutputTargetState.Absent) : OutputTarget.Check(TargetPath, _force, _option);
            try
            {
                Place(state);
                _committed = true;
                return TargetPath;
            }
            catch (IOException) when (attempt < 20 && (_numberIfTaken || Directory.Exists(TargetPath)))
            {
                // Another run took the name between the check and the rename: check again (a refusal
                // names what is there now; a default name moves on to the next number).
            }
        }
    }

    private void Place(OutputTargetState state)
    {
        switch (state)
        {
            case OutputTargetState.Absent:
                Directory.Move(StagingPath, TargetPath);
                break;
            case OutputTargetState.Empty:
                Directory.Delete(TargetPath, recursive: false); // fails, as it should, if anything appeared in it
                Directory.Move(StagingPath, TargetPath);
                break;
            case OutputTargetState.ArenaOutput:
                string aside = Path.Combine(Path.GetDirectoryName(TargetPath)!, $".{Path.GetFileName(TargetPath)}.replaced-{Guid.NewGuid():N}"[..^24]);
                Directory.Move(TargetPath, aside);
                try
                {
                    Directory.Move(StagingPath, TargetPath);
                }
                catch (IOException)
                {
                    Directory.Move(aside, TargetPath);
                    throw;
                }
                RemoveReplaced(aside);
                break;
        }
    }

    private static void RemoveReplaced(string aside)
    {
        // Checked again after the rename: only a folder that still holds nothing but arena files is deleted.
        var marker = OutputMarker.Read(aside);
        if (marker is null || marker.FirstForeignEntry(aside) is not null) return;
        try
        {
            Directory.Delete(aside, recursive: true);
        }
        catch (IOException)
        {
            // Left as a hidden folder; it holds only arena output.
        }
    }

    private static string FreeName(string target)
    {
        string candidate = target;
        for (int n = 2; Directory.Exists(candidate) || File.Exists(candidate); n++)
        {
            if (n > 10_000) throw new ArenaInputException($"no free folder name like '{target}'", "--out");
            candidate = $"{target}-{n}";
        }
        return candidate;
    }

    /// <summary>Removes the staging folder unless the output was committed.</summary>
    public void Dispose()
    {
        if (_committed) return;
        try
        {
            if (Directory.Exists(StagingPath)) Directory.Delete(StagingPath, recursive: true);
        }
        catch (IOException)
        {
            // A stage that cannot be removed is hidden and named as such.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
