namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Constant voltage: hold the reference at a fixed fraction of the array's STC open-circuit voltage.
/// The floor every tracker must beat.
/// </summary>
/// <remarks>Esram &amp; Chapman, IEEE Trans. Energy Conversion 22(2), 2007, lists it among the
/// simplest methods; the fraction is the same k1 as in the fractional-Voc method.</remarks>
public sealed class ConstantVoltage : IMpptTracker
{
    private readonly double _fraction;
    private double _reference;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("fraction", "-", 0.78, 0.3, 1.0, "Reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <summary>A tracker from settings.</summary>
    public ConstantVoltage(TrackerSettings s) => _fraction = s["fraction"];

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _reference = Math.Clamp(_fraction * context.NominalOpenCircuitVoltageV, context.MinCommand, context.MaxCommand);
        return _reference;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m) => _reference;
}
