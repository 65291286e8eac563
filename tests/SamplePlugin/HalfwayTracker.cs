using MpptArena.Trackers;

namespace SamplePlugin;

/// <summary>A deliberately simple plug-in: holds the reference at a declared fraction of the STC open-circuit voltage.</summary>
[TrackerKind("sample_fraction", Summary = "Test plug-in: fixed fraction of Voc", Source = "test fixture")]
public sealed class HalfwayTracker(TrackerSettings settings) : IMpptTracker
{
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
        [new("fraction", "-", 0.75, 0.1, 1.0, "Reference as a fraction of the STC open-circuit voltage")];

    private double _reference;

    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    public double Reset(TrackerContext context) => _reference = settings["fraction"] * context.NominalOpenCircuitVoltageV;

    public double Step(in TrackerMeasurement measurement) => _reference;
}

/// <summary>Marked as a tracker but built wrong: no constructor taking TrackerSettings.</summary>
public sealed class NotATrackerShape
{
}
