namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Fixed-step perturb and observe on the voltage reference: move the reference by a fixed step; if
/// power rose, keep going the same way, otherwise turn back.
/// </summary>
/// <remarks>
/// N. Femia, G. Petrone, G. Spagnuolo, M. Vitelli, "Optimization of perturb and observe maximum power
/// point tracking method", IEEE Trans. Power Electronics 20(4), 2005, 963-973. At steady state it
/// cycles through three levels (Vmpp - dV, Vmpp, Vmpp + dV) with period 4 T.
/// </remarks>
public sealed class PerturbAndObserve : IMpptTracker
{
    private readonly double _stepV;
    private readonly double _startFraction;
    private TrackerContext _context = null!;
    private double _reference;
    private HillClimbDirection _climb;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("step_v", "V", 2.0, 1e-3, 1e4, "Perturbation of the voltage reference per sample"),
        new("start_fraction", "-", 0.8, 0.0, 1.2, "Initial reference as a fraction of the array's STC open-circuit voltage"),
    ];

    /// <summary>A tracker from settings.</summary>
    public PerturbAndObserve(TrackerSettings s)
    {
        _stepV = s["step_v"];
        _startFraction = s["start_fraction"];
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _context = context;
        _climb.Reset(-1);
        _reference = Math.Clamp(_startFraction * context.NominalOpenCircuitVoltageV, context.MinCommand, context.MaxCommand);
        return _reference;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        _reference = Math.Clamp(_reference + _climb.Next(m.PowerW) * _stepV, _context.MinCommand, _context.MaxCommand);
        return _reference;
    }
}
