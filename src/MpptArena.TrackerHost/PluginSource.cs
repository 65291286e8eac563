using MpptArena.Trackers;

namespace MpptArena.Host;

/// <summary>A tracker kind of a .NET plug-in, loaded in a fresh collectible context for every instance (fresh static fields).</summary>
internal sealed class PluginSource(string assemblyPath, string kind) : IHostedSource
{
    public (TrackerCommandKind Kind, string Summary, IReadOnlyList<TrackerParameter> Parameters) Describe()
    {
        var (descriptor, context) = TrackerPluginLoader.LoadFresh(assemblyPath, kind);
        try
        {
            var probe = descriptor.Create(new TrackerSettings(descriptor.Parameters, new Dictionary<string, double>()));
            var commandKind = probe.CommandKind;
            (probe as IDisposable)?.Dispose();
            return (commandKind, descriptor.Summary, descriptor.Parameters);
        }
        finally
        {
            context.Unload();
        }
    }

    public (IMpptTracker Tracker, Action Release) Create(TrackerSettings settings)
    {
        var (descriptor, context) = TrackerPluginLoader.LoadFresh(assemblyPath, kind);
        var tracker = descriptor.Create(settings);
        return (tracker, () =>
        {
            (tracker as IDisposable)?.Dispose();
            context.Unload();
        });
    }
}
