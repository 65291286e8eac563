using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace MpptArena.Host;

/// <summary>
/// Takes the protocol streams away from the tracker: on Unix the host keeps private duplicates of its
/// standard input and output for the frames, points file descriptor 1 at standard error (so a tracker's
/// printf lands in its log, never in a frame) and descriptor 0 at /dev/null. On Windows the standard
/// handles carry the frames as they are and managed output is sent to standard error.
/// </summary>
internal static partial class StandardStreams
{
    public static (Stream Input, Stream Output) TakeProtocolStreams()
    {
        Console.SetOut(Console.Error);
        if (OperatingSystem.IsWindows()) return (Console.OpenStandardInput(), Console.OpenStandardOutput());
        int input = Dup(0), output = Dup(1);
        if (input < 0 || output < 0 || Dup2(2, 1) < 0) throw new IOException("could not set up the protocol streams (dup failed)");
        int devNull = Open("/dev/null", 0);
        if (devNull >= 0)
        {
            Dup2(devNull, 0);
            Close(devNull);
        }
        if (OperatingSystem.IsLinux())
        {
            // The host must not outlive the arena, even if the tracker spins and never reads its input again.
            const int prSetPdeathsig = 1, sigkill = 9;
            Prctl(prSetPdeathsig, sigkill, 0, 0, 0);
        }
        return (new FileStream(new SafeFileHandle(input, true), FileAccess.Read, 1), new FileStream(new SafeFileHandle(output, true), FileAccess.Write, 1));
    }

    [LibraryImport("libc", EntryPoint = "dup")]
    private static partial int Dup(int fd);

    [LibraryImport("libc", EntryPoint = "dup2")]
    private static partial int Dup2(int from, int to);

    [LibraryImport("libc", EntryPoint = "open", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Open(string path, int flags);

    [LibraryImport("libc", EntryPoint = "close")]
    private static partial int Close(int fd);

    [LibraryImport("libc", EntryPoint = "prctl")]
    private static partial int Prctl(int option, ulong arg2, ulong arg3, ulong arg4, ulong arg5);
}
