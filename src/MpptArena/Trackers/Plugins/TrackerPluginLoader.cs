using System.Reflection;
using System.Runtime.Loader;

namespace MpptArena.Trackers;

/// <summary>
/// Loads tracker kinds from a user's .NET assembly by path: every public class marked
/// <see cref="TrackerKindAttribute"/>. Each plug-in gets its own load context, so its dependencies do
/// not clash with the arena's.
/// </summary>
public static class TrackerPluginLoader
{
    /// <summary>Registers every tracker kind in the assembly at <paramref name="path"/>; returns the kinds added.</summary>
    /// <exception cref="ArenaInputException">Missing file, not an assembly, no tracker, or a tracker of the wrong shape.</exception>
    public static IReadOnlyList<string> LoadInto(TrackerRegistry registry, string path)
    {
        string full = Path.GetFullPath(path);
        if (!File.Exists(full)) throw new ArenaInputException($"tracker plug-in '{path}' not found", "plugin");
        Assembly assembly;
        try
        {
            assembly = new PluginLoadContext(full).LoadFromAssemblyPath(full);
        }
        catch (BadImageFormatException)
        {
            throw new ArenaInputException($"tracker plug-in '{path}' is not a .NET assembly (for C firmware trackers use 'type: native' with 'library' in the tracker's entry)", "plugin");
        }
        Type[] types;
        try
        {
            types = assembly.GetExportedTypes();
        }
        catch (Exception ex) when (ex is ReflectionTypeLoadException or FileNotFoundException or TypeLoadException)
        {
            throw new ArenaInputException($"tracker plug-in '{path}' could not be loaded: {ex.Message}", "plugin");
        }
        var added = new List<string>();
        foreach (var type in types)
        {
            var attribute = type.GetCustomAttribute<TrackerKindAttribute>();
            if (attribute is null) continue;
            registry.Register(Describe(type, attribute, path));
            added.Add(attribute.Kind);
        }
        if (added.Count == 0)
        {
            throw new ArenaInputException($"tracker plug-in '{path}' holds no public class marked [TrackerKind(\"name\")] that implements IMpptTracker", "plugin");
        }
        return added;
    }

    /// <summary>
    /// Loads <paramref name="path"/> afresh in a collectible context of its own and returns the descriptor of
    /// <paramref name="kind"/>: every instance made this way starts with its own static fields. Unload the
    /// context when the instance is done.
    /// </summary>
    public static (TrackerDescriptor Descriptor, AssemblyLoadContext Context) LoadFresh(string path, string kind)
    {
        string full = Path.GetFullPath(path);
        if (!File.Exists(full)) throw new ArenaInputException($"tracker plug-in '{path}' not found", "plugin");
        var context = new PluginLoadContext(full, collectible: true);
        var assembly = context.LoadFromAssemblyPath(full);
        foreach (var type in assembly.GetExportedTypes())
        {
            var attribute = type.GetCustomAttribute<TrackerKindAttribute>();
            if (attribute?.Kind == kind) return (Describe(type, attribute, path), context);
        }
        context.Unload();
        throw new ArenaInputException($"tracker plug-in '{path}' holds no tracker kind '{kind}'", "plugin");
    }

    /// <summary>A descriptor for a plug-in type, after checking its shape.</summary>
    public static TrackerDescriptor Describe(Type type, TrackerKindAttribute attribute, string origin)
    {
        string name = $"{type.FullName} in '{origin}'";
        if (!typeof(IMpptTracker).IsAssignableFrom(type) || type.IsAbstract)
        {
            throw new ArenaInputException($"{name} is marked as a tracker but does not implement IMpptTracker (or is abstract)", "plugin");
        }
        var ctor = type.GetConstructor([typeof(TrackerSettings)])
                   ?? throw new ArenaInputException($"{name} needs a public constructor taking TrackerSettings (the checked parameter values)", "plugin");
        IReadOnlyList<TrackerParameter> parameters = [];
        var property = type.GetProperty("Parameters", BindingFlags.Public | BindingFlags.Static);
        if (property is not null)
        {
            parameters = property.GetValue(null) as IReadOnlyList<TrackerParameter>
                         ?? throw new ArenaInputException($"{name}: static property 'Parameters' must be an IReadOnlyList<TrackerParameter>", "plugin");
        }
        return new TrackerDescriptor(attribute.Kind, attribute.Summary, attribute.Source, parameters,
            settings =>
            {
                try
                {
                    return (IMpptTracker)ctor.Invoke([settings]);
                }
                catch (TargetInvocationException ex) when (ex.InnerException is not null)
                {
                    throw new ArenaInputException($"{name}: constructor threw {ex.InnerException.GetType().Name}: {ex.InnerException.Message}", "plugin");
                }
            })
        {
            Origin = TrackerOrigin.Plugin,
            OriginPath = Path.GetFullPath(origin),
        };
    }

    private sealed class PluginLoadContext(string path, bool collectible = false) : AssemblyLoadContext(Path.GetFileNameWithoutExtension(path), collectible)
    {
        private readonly AssemblyDependencyResolver _resolver = new(path);

        protected override Assembly? Load(AssemblyName name)
        {
            // The contract assembly must be the arena's own, or the plug-in's types would not match.
            if (name.Name == typeof(IMpptTracker).Assembly.GetName().Name) return typeof(IMpptTracker).Assembly;
            string? resolved = _resolver.ResolveAssemblyToPath(name);
            return resolved is null ? null : LoadFromAssemblyPath(resolved);
        }

        protected override IntPtr LoadUnmanagedDll(string unmanagedDllName)
        {
            string? resolved = _resolver.ResolveUnmanagedDllToPath(unmanagedDllName);
            return resolved is null ? IntPtr.Zero : LoadUnmanagedDllFromPath(resolved);
        }
    }
}
