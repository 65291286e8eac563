using MpptArena.Runs;
using MpptArena.Trackers;

namespace MpptArena.Cli.Terminal;

/// <summary>
/// logs/ of a results folder: one file per user tracker for what its host writes (its printf, its console, a
/// runtime's crash report, the arena's failure record), and in-process.log for console output of user code
/// that runs inside the arena. Files are created only for trackers that are not built in.
/// </summary>
internal sealed class TrackerLogs(string folder) : IDisposable
{
    private readonly List<StreamWriter> _open = [];

    /// <summary>The log of <paramref name="spec"/>, or null for a built-in.</summary>
    public TextWriter? For(TrackerSpec spec)
    {
        if (spec.Descriptor.Origin == TrackerOrigin.BuiltIn) return null;
        return Open(spec.Name + ".log");
    }

    /// <summary>While the returned scope lives, Console.Out and Console.Error point at logs/in-process.log (the tool writes through <see cref="StandardOutput"/>).</summary>
    public IDisposable DivertConsole(bool divert)
    {
        if (!divert) return new Scope(null, null);
        var writer = Open("in-process.log");
        var (oldOut, oldError) = (Console.Out, Console.Error);
        Console.SetOut(writer);
        Console.SetError(writer);
        return new Scope(oldOut, oldError);
    }

    private StreamWriter Open(string name)
    {
        Directory.CreateDirectory(folder);
        var writer = new StreamWriter(Path.Combine(folder, name), append: false) { AutoFlush = true };
        lock (_open) _open.Add(writer);
        return writer;
    }

    public void Dispose()
    {
        lock (_open)
        {
            foreach (var w in _open) w.Dispose();
            _open.Clear();
        }
    }

    private sealed class Scope(TextWriter? oldOut, TextWriter? oldError) : IDisposable
    {
        public void Dispose()
        {
            if (oldOut is not null) Console.SetOut(oldOut);
            if (oldError is not null) Console.SetError(oldError);
        }
    }
}
