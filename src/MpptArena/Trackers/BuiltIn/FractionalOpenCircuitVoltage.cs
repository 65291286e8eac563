namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// Fractional open-circuit voltage: every interval, let the array go to open circuit for a moment,
/// measure Voc, then hold the reference at k Voc.
/// </summary>
/// <remarks>
/// T. Esram, P. L. Chapman, "Comparison of photovoltaic array maximum power point tracking
/// techniques", IEEE Trans. Energy Conversion 22(2), 2007, sec. II-C: Vmpp ~ k1 Voc with k1 about
/// 0.71-0.78 (from memory). Under partial shading k1 no longer holds (same source).
/// </remarks>
public sealed class FractionalOpenCircuitVoltage : IMpptTracker
{
    private readonly double _k, _intervalS;
    private readonly int _holdSamples;
    private TrackerContext _context = null!;
    private double _reference, _nextMeasureS;
    private int _openSamplesLeft;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("k", "-", 0.76, 0.5, 0.95, "Vref = k Voc"),
        new("interval_s", "s", 5.0, 0.01, 3600, "Time between open-circuit measurements"),
        new("open_samples", "-", 3, 1, 1000, "Samples spent at open circuit before reading Voc"),
    ];

    /// <summary>A tracker from settings.</summary>
    public FractionalOpenCircuitVoltage(TrackerSettings s)
    {
        _k = s["k"];
        _intervalS = s["interval_s"];
        _holdSamples = (int)s["open_samples"];
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _context = context;
        _nextMeasureS = 0;
        _openSamplesLeft = _holdSamples;
        _reference = context.MaxCommand; // start with an open-circuit measurement
        return _reference;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        if (_openSamplesLeft > 0)
        {
            _openSamplesLeft--;
            if (_openSamplesLeft == 0)
            {
                _reference = Math.Clamp(_k * m.VoltageV, _context.MinCommand, _context.MaxCommand);
                _nextMeasureS = m.TimeS + _intervalS;
            }
            return _reference;
        }
        if (m.TimeS >= _nextMeasureS)
        {
            _openSamplesLeft = _holdSamples;
            _reference = _context.MaxCommand;
        }
        return _reference;
    }
}
