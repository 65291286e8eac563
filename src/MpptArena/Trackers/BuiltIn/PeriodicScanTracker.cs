namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// A global tracker: at start, every scan interval, and early when power jumps, sweep the voltage
/// reference across the range, remember the best point, go there, and hill-climb locally (perturb
/// and observe) until the next scan. Finds the global peak where purely local trackers stay on a lower one.
/// </summary>
/// <remarks>
/// The periodic sweep ("current/voltage sweep") is reviewed by T. Esram, P. L. Chapman, IEEE Trans.
/// Energy Conversion 22(2), 2007; a global search under partial shading followed by local tracking,
/// triggered by a change of power, by H. Patel, V. Agarwal, "Maximum power point tracking scheme for PV
/// systems operating under partially shaded conditions", IEEE Trans. Industrial Electronics 55(4), 2008.
/// </remarks>
public sealed class PeriodicScanTracker : IMpptTracker
{
    private readonly double _intervalS, _lowFraction, _highFraction, _stepV, _triggerFraction, _minGapS;
    private readonly int _points;
    private TrackerContext _context = null!;
    private double _reference, _lastScanS, _previousPowerW, _bestPowerW, _bestV;
    private int _scanIndex; // -1 when tracking
    private HillClimbDirection _climb;

    /// <summary>Declared parameters.</summary>
    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
    [
        new("scan_interval_s", "s", 10.0, 0.1, 3600, "Time between scans"),
        new("scan_points", "-", 40, 3, 2000, "Voltage points visited per scan, one sample each"),
        new("low_fraction", "-", 0.1, 0.0, 1.0, "Scan start as a fraction of the array's STC open-circuit voltage"),
        new("high_fraction", "-", 0.95, 0.0, 1.2, "Scan end as a fraction of the array's STC open-circuit voltage"),
        new("step_v", "V", 2.0, 1e-3, 1e4, "Perturbation of the local perturb-and-observe between scans"),
        new("trigger_fraction", "-", 0.15, 0.0, 10.0, "Relative power change between samples that starts a scan early"),
        new("min_gap_s", "s", 1.0, 0.0, 3600, "Shortest time between two scans"),
    ];

    /// <summary>A tracker from settings.</summary>
    public PeriodicScanTracker(TrackerSettings s)
    {
        _intervalS = s["scan_interval_s"];
        _points = (int)s["scan_points"];
        _lowFraction = s["low_fraction"];
        _highFraction = s["high_fraction"];
        _stepV = s["step_v"];
        _triggerFraction = s["trigger_fraction"];
        _minGapS = s["min_gap_s"];
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    /// <summary>True while a scan is under way.</summary>
    public bool IsScanning => _scanIndex >= 0;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        _context = context;
        _previousPowerW = 0;
        StartScan(0.0);
        return _reference;
    }

    private double ScanVoltage(int j)
    {
        double voc = _context.NominalOpenCircuitVoltageV;
        double v = voc * (_lowFraction + (_highFraction - _lowFraction) * j / (_points - 1));
        return Math.Clamp(v, _context.MinCommand, _context.MaxCommand);
    }

    private void StartScan(double timeS)
    {
        _scanIndex = 0;
        _bestPowerW = double.NegativeInfinity;
        _lastScanS = timeS;
        _reference = ScanVoltage(0);
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        double p = m.PowerW;
        if (_scanIndex >= 0)
        {
            // This sample shows the effect of the point commanded at the previous sample.
            if (p > _bestPowerW)
            {
                _bestPowerW = p;
                _bestV = _reference;
            }
            _scanIndex++;
            if (_scanIndex < _points)
            {
                _reference = ScanVoltage(_scanIndex);
                return _reference;
            }
            _scanIndex = -1;
            _reference = _bestV;
            _previousPowerW = 0;
            _climb.Reset(-1);
            return _reference;
        }

        bool due = m.TimeS - _lastScanS >= _intervalS;
        bool jumped = _previousPowerW > 0 && Math.Abs(p - _previousPowerW) > _triggerFraction * _previousPowerW
                      && m.TimeS - _lastScanS >= _minGapS;
        if (due || jumped)
        {
            StartScan(m.TimeS);
            return _reference;
        }
        _previousPowerW = p;
        _reference = Math.Clamp(_reference + _climb.Next(p) * _stepV, _context.MinCommand, _context.MaxCommand);
        return _reference;
    }
}
