using MpptArena;
using MpptArena.Trackers;
using MpptArena.Trackers.Isolation;

namespace MpptArena.Host;

/// <summary>
/// mppt-arena-host: serves one tracker instance at a time to the arena over the tracker host protocol
/// (docs/tracker-host-protocol.md) on its standard streams.
///   mppt-arena-host native LIBRARY          a C tracker library
///   mppt-arena-host plugin ASSEMBLY KIND    a tracker kind of a .NET plug-in
/// </summary>
internal static class Program
{
    public static int Main(string[] args)
    {
        var (input, output) = StandardStreams.TakeProtocolStreams();
        var reader = new FrameReader(input);
        var builder = new FrameBuilder();
        IHostedSource? source = null;
        HostHello hello;
        try
        {
            source = args switch
            {
                ["native", var library] => new NativeSource(library),
                ["plugin", var assembly, var kind] => new PluginSource(assembly, kind),
                _ => throw new ArenaInputException("usage: mppt-arena-host native LIBRARY | plugin ASSEMBLY KIND", "arguments"),
            };
            var (commandKind, summary, parameters) = source.Describe();
            hello = new HostHello(HostProtocol.Version, HostProtocol.SharedSlotFlag, commandKind, summary, parameters);
        }
        catch (Exception ex)
        {
            SendError(builder, output, ex is ArenaInputException ? "could not load" : $"threw {ex.GetType().Name} while loading", ex);
            (source as NativeSource)?.DeleteCopies();
            return 2;
        }
        HostMessages.Hello(builder, hello).SendTo(output);
        var server = new HostServer(source!, hello.Parameters, reader, builder, output);
        try
        {
            server.Serve();
        }
        finally
        {
            server.Release();
            (source as NativeSource)?.DeleteCopies();
        }
        return 0;
    }

    /// <summary>Sends an ERROR frame and writes the whole exception to standard error (the tracker's log).</summary>
    public static void SendError(FrameBuilder builder, Stream output, string kind, Exception ex)
    {
        // Bad input (a file that is not a tracker library) is a message, not a crash: no stack trace.
        string message = ex is ArenaInputException a ? a.Message : ex.Message;
        string details = ex is ArenaInputException ? "" : ex.ToString();
        Console.Error.WriteLine($"mppt-arena-host: {kind}: {(details.Length > 0 ? details : message)}");
        HostMessages.Error(builder, kind, message, details).SendTo(output);
    }
}
