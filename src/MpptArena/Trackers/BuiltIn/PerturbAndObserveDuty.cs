namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Perturb and observe acting directly on the duty cycle, as the simplest firmware does (no inner
/// voltage loop): step the duty cycle; keep the direction while power rises.
/// </summary>
/// <remarks>Femia, Petrone, Spagnuolo, Vitelli, IEEE Trans. Power Electronics 20(4), 2005 (the
/// method is the same with the duty cycle as the perturbed variable).</remarks>
public sealed class PerturbAndObserveDuty : IMpptTracker
{
    private readonly double _step;
    private readonly double _start;
    private TrackerContext _context = null!;
    private double _duty;
    private HillClimbDirection _climb;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("step_duty", "-", 0.005, 1e-5, 0.2, "Perturbation of the duty cycle per sample"),
        new("start_duty", "-", 0.5, 0.0, 1.0, "Initial duty cycle"),
    ];

    /// <summary>A tracker from settings.</summary>
    public PerturbAndObserveDuty(TrackerSettings s)
    {
        _step = s["step_duty"];
        _start = s["start_duty"];
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.DutyCycle;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _context = context;
        _climb.Reset(1);
        _duty = Math.Clamp(_start, context.MinCommand, context.MaxCommand);
        return _duty;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        _duty = Math.Clamp(_duty + _climb.Next(m.PowerW) * _step, _context.MinCommand, _context.MaxCommand);
        return _duty;
    }
}
