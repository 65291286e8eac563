using System.Runtime.InteropServices;

namespace MpptArena.Trackers.Native;

/// <summary>
/// A shared library that provides a tracker through the C ABI of mppt_arena_tracker.h: loaded with
/// <see cref="NativeLibrary"/>, its exports bound once to unmanaged function pointers, its ABI version
/// and declared parameters read at load.
/// </summary>
public sealed unsafe class NativeTrackerLibrary
{
    private static readonly string[] Required =
        ["mppt_arena_abi_version", "mppt_arena_command_kind", "mppt_arena_create", "mppt_arena_step", "mppt_arena_destroy"];

    internal delegate* unmanaged<IntPtr, int, NativeAbi.Context*, double*, IntPtr> Create;
    internal delegate* unmanaged<IntPtr, NativeAbi.Measurement*, double> Step;
    internal delegate* unmanaged<IntPtr, void> Destroy;

    private IntPtr _handle;

    private NativeTrackerLibrary(string path, TrackerCommandKind kind, IReadOnlyList<TrackerParameter> parameters)
    {
        Path = path;
        CommandKind = kind;
        Parameters = parameters;
    }

    /// <summary>Full path of the library.</summary>
    public string Path { get; }

    /// <summary>What its commands mean.</summary>
    public TrackerCommandKind CommandKind { get; }

    /// <summary>Parameters it declares (empty if it declares none).</summary>
    public IReadOnlyList<TrackerParameter> Parameters { get; }

    /// <summary>A descriptor that builds trackers from this library.</summary>
    public TrackerDescriptor Descriptor => new("native", $"C tracker from {System.IO.Path.GetFileName(Path)}", Path, Parameters, s => new NativeTracker(this, s))
    {
        Origin = TrackerOrigin.Native,
        OriginPath = Path,
        DeclaredCommandKind = CommandKind,
    };

    /// <summary>Loads and checks a library.</summary>
    /// <exception cref="ArenaInputException">Missing file, not loadable, a missing symbol, or another ABI version.</exception>
    public static NativeTrackerLibrary Load(string path)
    {
        string full = System.IO.Path.GetFullPath(path);
        if (!File.Exists(full)) throw new ArenaInputException($"native tracker library '{path}' not found", "library");
        IntPtr handle;
        try
        {
            handle = NativeLibrary.Load(full);
        }
        catch (Exception ex) when (ex is DllNotFoundException or BadImageFormatException)
        {
            // The loader's own reason (dlerror: "file too short", "invalid ELF header") is the last line of the message.
            string reason = ex.Message.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[^1];
            if (reason.StartsWith(path + ": ", StringComparison.Ordinal)) reason = reason[(path.Length + 2)..];
            throw new ArenaInputException($"native tracker library '{path}' could not be loaded: {reason}", "library");
        }
        var exports = new Dictionary<string, IntPtr>();
        foreach (string name in Required)
        {
            if (!NativeLibrary.TryGetExport(handle, name, out IntPtr p))
            {
                throw new ArenaInputException($"native tracker library '{path}' does not export '{name}', which mppt_arena_tracker.h (ABI {NativeAbi.Version}) requires", "library");
            }
            exports[name] = p;
        }
        uint version = ((delegate* unmanaged<uint>)exports["mppt_arena_abi_version"])();
        if (version != NativeAbi.Version)
        {
            throw new ArenaInputException($"native tracker library '{path}' was built for tracker ABI {version}; this mppt-arena speaks ABI {NativeAbi.Version} (rebuild it against the shipped mppt_arena_tracker.h)", "library");
        }
        int kindCode = ((delegate* unmanaged<int>)exports["mppt_arena_command_kind"])();
        var kind = kindCode switch
        {
            0 => TrackerCommandKind.VoltageReference,
            1 => TrackerCommandKind.DutyCycle,
            _ => throw new ArenaInputException($"native tracker library '{path}': mppt_arena_command_kind returned {kindCode}; expected 0 (voltage reference) or 1 (duty cycle)", "library"),
        };
        var parameters = ReadParameters(handle, path);
        return new NativeTrackerLibrary(full, kind, parameters)
        {
            _handle = handle,
            Create = (delegate* unmanaged<IntPtr, int, NativeAbi.Context*, double*, IntPtr>)exports["mppt_arena_create"],
            Step = (delegate* unmanaged<IntPtr, NativeAbi.Measurement*, double>)exports["mppt_arena_step"],
            Destroy = (delegate* unmanaged<IntPtr, void>)exports["mppt_arena_destroy"],
        };
    }

    /// <summary>Unloads the library; no tracker of it may be used afterwards.</summary>
    public void Free()
    {
        if (_handle == IntPtr.Zero) return;
        NativeLibrary.Free(_handle);
        _handle = IntPtr.Zero;
    }

    private static List<TrackerParameter> ReadParameters(IntPtr handle, string path)
    {
        var list = new List<TrackerParameter>();
        bool hasCount = NativeLibrary.TryGetExport(handle, "mppt_arena_parameter_count", out IntPtr countPtr);
        bool hasDescribe = NativeLibrary.TryGetExport(handle, "mppt_arena_describe_parameter", out IntPtr describePtr);
        if (!hasCount && !hasDescribe) return list;
        if (hasCount != hasDescribe)
        {
            throw new ArenaInputException($"native tracker library '{path}' exports only one of 'mppt_arena_parameter_count' and 'mppt_arena_describe_parameter'; export both or neither", "library");
        }
        int count = ((delegate* unmanaged<int>)countPtr)();
        var describe = (delegate* unmanaged<int, NativeAbi.ParameterInfo*, int>)describePtr;
        for (int k = 0; k < count; k++)
        {
            NativeAbi.ParameterInfo info;
            if (describe(k, &info) != 0 || info.Name == IntPtr.Zero)
            {
                throw new ArenaInputException($"native tracker library '{path}': mppt_arena_describe_parameter({k}) failed", "library");
            }
            string name = Marshal.PtrToStringUTF8(info.Name)!;
            if (!(info.Min <= info.Default && info.Default <= info.Max))
            {
                throw new ArenaInputException($"native tracker library '{path}': parameter '{name}' has default {info.Default} outside its range [{info.Min}, {info.Max}]", "library");
            }
            list.Add(new TrackerParameter(name, Marshal.PtrToStringUTF8(info.Unit) ?? "-", info.Default, info.Min, info.Max,
                Marshal.PtrToStringUTF8(info.Description) ?? ""));
        }
        return list;
    }
}
