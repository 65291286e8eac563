using MpptArena;
using MpptArena.Trackers;
using MpptArena.Trackers.Native;

namespace MpptArena.Host;

/// <summary>
/// A C tracker library, loaded from a private copy for every instance: the dynamic loader maps a file it has
/// not seen as a new object, so each instance gets the library's globals as the file initialises them, even
/// in a host that served other instances before.
/// </summary>
internal sealed class NativeSource(string libraryPath) : IHostedSource
{
    private readonly string _folder = Directory.CreateTempSubdirectory("mppt-arena-host-").FullName;
    private int _copies;

    public (TrackerCommandKind Kind, string Summary, IReadOnlyList<TrackerParameter> Parameters) Describe()
    {
        var (library, release) = LoadCopy();
        try
        {
            return (library.CommandKind, $"C tracker from {Path.GetFileName(libraryPath)}", library.Parameters);
        }
        finally
        {
            release();
        }
    }

    public (IMpptTracker Tracker, Action Release) Create(TrackerSettings settings)
    {
        var (library, release) = LoadCopy();
        var tracker = (NativeTracker)library.Descriptor.Create(settings);
        return (tracker, () =>
        {
            tracker.Dispose();
            release();
        });
    }

    private (NativeTrackerLibrary Library, Action Release) LoadCopy()
    {
        string copy = Path.Combine(_folder, $"{++_copies}-{Path.GetFileName(libraryPath)}");
        File.Copy(libraryPath, copy);
        try
        {
            var library = NativeTrackerLibrary.Load(copy);
            return (library, () =>
            {
                library.Free();
                File.Delete(copy);
            });
        }
        catch (ArenaInputException ex)
        {
            File.Delete(copy);
            // The message names the user's file, not the private copy.
            throw new ArenaInputException(ex.Reason.Replace(copy, libraryPath, StringComparison.Ordinal), ex.Field);
        }
        catch
        {
            File.Delete(copy);
            throw;
        }
    }

    public void DeleteCopies()
    {
        try
        {
            Directory.Delete(_folder, true);
        }
        catch (IOException)
        {
            // A library still mapped; the temp cleaner takes it.
        }
    }
}
