using MpptArena.Trackers;

namespace MpptArena.Cli.Commands;

/// <summary>The tracker registry for a command: built-ins plus plug-in assemblies named on the command line.</summary>
internal static class Plugins
{
    public static TrackerRegistry Registry(IReadOnlyList<string> assemblies)
    {
        var registry = TrackerRegistry.WithBuiltIns();
        foreach (string path in assemblies) TrackerPluginLoader.LoadInto(registry, path);
        return registry;
    }
}
