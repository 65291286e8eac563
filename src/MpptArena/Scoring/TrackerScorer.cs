using MpptArena.Numerics;

namespace MpptArena.Scoring;

/// <summary>
/// Accumulates every score of one tracker as the run goes, from one <see cref="PlantSample"/> per plant
/// step, so that no series is held in memory.
/// </summary>
/// <remarks>
/// Efficiency is the energy ratio of IEC 62891:2020 / EN 50530:2010: the integral of v i dt over the
/// integral of P_MPP dt, over the same window. Settling: after each event, the time until power enters
/// a band of +/- band * P_MPP around the MPP power and stays there for the hold time. Once settled, a
/// sample inside the band counts towards oscillation (ripple), and one outside it, with no event in between,
/// is an excursion: a deliberate scan or open-circuit sample, or a perturbation larger than the band. Its
/// loss is reported on its own (excursion_energy_lost_wh), so a scan is not read as volts of ripple.
/// </remarks>
public sealed class TrackerScorer
{
    private readonly ScoringSettings _settings;
    private readonly double[] _windowEnergyJ, _windowAvailableJ;
    private readonly List<SettlingScore> _settling = [];
    private CompensatedSum _energyJ, _availableJ;
    private double _staticEnergyJ, _staticAvailableJ;
    private double _multiPeakS, _onGlobalS, _lowerLossJ;

    private double _eventS = double.NaN;
    private string _eventLabel = "";
    private double _inBandSince = double.NaN;
    private double? _settledAfterS;
    private bool _settled;

    private double _spanStartS, _vDevMin, _vDevMax, _pDevMin, _pDevMax, _spanLossJ;
    private double _rippleWeightS, _rippleVSum, _ripplePSum, _rippleLossJ, _rippleTimeS;
    private double _spanExcursionS, _excursionLossJ, _excursionTimeS;

    // Energy split: each step's loss goes to exactly one part (see EnergySplit).
    private CompensatedSum _lostStartupJ, _lostAfterEventsJ, _lostSteadyJ, _lostLowerHillJ, _lostExcursionsJ, _lostAfterFailureJ;

    // Stall: the command and the MPP voltage when it last changed.
    private double _heldCommand = double.NaN, _mppVAtCommand, _stallTimeS, _stallLossJ;
    private bool _stalling;
    private double? _firstStallS;

    /// <summary>Label of the start-up event at t = 0; its settling time is the start-up time.</summary>
    public const string StartupLabel = "start-up";

    /// <summary>A scorer for one tracker.</summary>
    public TrackerScorer(ScoringSettings settings)
    {
        _settings = settings;
        _windowEnergyJ = new double[settings.AllWindows.Count];
        _windowAvailableJ = new double[settings.AllWindows.Count];
    }

    /// <summary>Marks an event (start-up, a change of conditions) from which settling is timed.</summary>
    public void MarkEvent(double timeS, string label)
    {
        CloseRippleSpan(timeS);
        CloseEvent();
        _eventS = timeS;
        _eventLabel = label;
        _inBandSince = double.NaN;
        _settled = false;
        _settledAfterS = null;
    }

    /// <summary>Takes one plant step after the tracker failed: nothing is taken, everything available is lost.</summary>
    /// <param name="dtS">Step length [s].</param>
    /// <param name="mppPowerW">Power at the global MPP [W].</param>
    public void ObserveAfterFailure(double dtS, double mppPowerW) => _lostAfterFailureJ.Add(mppPowerW * dtS);

    /// <summary>Takes one plant step.</summary>
    public void Observe(in PlantSample s)
    {
        double e = s.PowerW * s.DtS, avail = s.MppPowerW * s.DtS;
        double lost = avail - e;
        BookLoss(s, lost);
        TrackStall(s, lost);
        _energyJ.Add(e);
        _availableJ.Add(avail);
        if (s.StableForS >= _settings.StaticAllowanceS)
        {
            _staticEnergyJ += e;
            _staticAvailableJ += avail;
        }
        var windows = _settings.AllWindows;
        for (int w = 0; w < windows.Count; w++)
        {
            if (s.TimeS > windows[w].StartS && s.TimeS <= windows[w].EndS)
            {
                _windowEnergyJ[w] += e;
                _windowAvailableJ[w] += avail;
            }
        }
        if (s.MultiPeak)
        {
            _multiPeakS += s.DtS;
            if (s.OnGlobalHill) _onGlobalS += s.DtS;
            else _lowerLossJ += Math.Max(avail - e, 0.0);
        }

        double band = _settings.SettlingBandFraction * s.MppPowerW;
        bool inBand = Math.Abs(s.MppPowerW - s.PowerW) <= band || s.MppPowerW <= 0;

        if (_settled)
        {
            double vDev = s.VoltageV - s.MppVoltageV, pDev = s.MppPowerW - s.PowerW;
            if (!inBand)
            {
                _excursionLossJ += pDev * s.DtS;
                _excursionTimeS += s.DtS;
                _spanExcursionS += s.DtS;
                return;
            }
            _vDevMin = Math.Min(_vDevMin, vDev); _vDevMax = Math.Max(_vDevMax, vDev);
            _pDevMin = Math.Min(_pDevMin, pDev); _pDevMax = Math.Max(_pDevMax, pDev);
            _spanLossJ += pDev * s.DtS;
            return;
        }
        if (double.IsNaN(_eventS)) return;
        if (!inBand)
        {
            _inBandSince = double.NaN;
            return;
        }
        if (double.IsNaN(_inBandSince)) _inBandSince = s.TimeS - s.DtS;
        if (s.TimeS - _inBandSince >= _settings.SettlingHoldS - 1e-12)
        {
            _settled = true;
            // Both instants lie on the plant-step grid; rounding to 1 ns drops the float noise of their
            // difference (7.1e-15 s for an event on the sample it settled in) without touching any real time.
            _settledAfterS = Math.Max(Math.Round(_inBandSince - _eventS, 9), 0.0);
            _spanStartS = s.TimeS;
            _vDevMin = _pDevMin = double.PositiveInfinity;
            _vDevMax = _pDevMax = double.NegativeInfinity;
            _spanLossJ = 0;
            _spanExcursionS = 0;
        }
    }

    /// <summary>Books one step's loss to its part of the split, by the precedence of <see cref="EnergySplit"/>; called before the step updates the settling state.</summary>
    private void BookLoss(in PlantSample s, double lostJ)
    {
        if (s.MultiPeak && !s.OnGlobalHill) _lostLowerHillJ.Add(lostJ);
        else if (!_settled) { if (_eventLabel == StartupLabel) _lostStartupJ.Add(lostJ); else _lostAfterEventsJ.Add(lostJ); }
        else if (Math.Abs(s.MppPowerW - s.PowerW) <= _settings.SettlingBandFraction * s.MppPowerW || s.MppPowerW <= 0) _lostSteadyJ.Add(lostJ);
        else _lostExcursionsJ.Add(lostJ);
    }

    /// <summary>
    /// Takes the command a tracker returned at a sample instant. A stall begins at a sample that returns the command
    /// unchanged although the global MPP voltage has moved by more than the stall fraction since the command last
    /// changed (the tracker was asked after the move and chose not to follow it), and lasts until a sample returns
    /// another command or finds the MPP back within the fraction. Between samples nobody can follow, so a jump of the
    /// MPP within one period is not a stall.
    /// </summary>
    /// <param name="timeS">Sample instant [s].</param>
    /// <param name="command">The command returned [V or -].</param>
    /// <param name="mppVoltageV">Voltage of the global MPP at that instant [V].</param>
    public void ObserveCommand(double timeS, double command, double mppVoltageV)
    {
        if (command != _heldCommand)
        {
            _heldCommand = command;
            _mppVAtCommand = mppVoltageV;
            _stalling = false;
            return;
        }
        _stalling = _mppVAtCommand > 0 && Math.Abs(mppVoltageV - _mppVAtCommand) > _settings.StallFraction * _mppVAtCommand;
        if (_stalling) _firstStallS ??= timeS;
    }

    private void TrackStall(in PlantSample s, double lostJ)
    {
        if (!_stalling) return;
        _stallTimeS += s.DtS;
        _stallLossJ += lostJ;
    }

    /// <summary>The energy split so far [Wh]; valid for a tracker that failed as well.</summary>
    public EnergySplit Split()
    {
        const double jPerWh = 3600.0;
        return new EnergySplit(_lostStartupJ.Value / jPerWh, _lostAfterEventsJ.Value / jPerWh, _lostSteadyJ.Value / jPerWh, _lostLowerHillJ.Value / jPerWh,
            _lostExcursionsJ.Value / jPerWh, _lostAfterFailureJ.Value / jPerWh);
    }

    /// <summary>The stall record so far.</summary>
    public StallRecord Stall() => new(_stallTimeS > 0, Math.Round(_stallTimeS, 9), _firstStallS is { } f ? Math.Round(f, 9) : null, _stallLossJ / 3600.0);

    private void CloseEvent()
    {
        if (double.IsNaN(_eventS)) return;
        _settling.Add(new SettlingScore(_eventS, _eventLabel, _settledAfterS));
        _eventS = double.NaN;
    }

    private void CloseRippleSpan(double endS)
    {
        if (!_settled) return;
        double span = endS - _spanStartS - _spanExcursionS;
        if (span > 0 && double.IsFinite(_vDevMax))
        {
            _rippleVSum += (_vDevMax - _vDevMin) * span;
            _ripplePSum += (_pDevMax - _pDevMin) * span;
            _rippleWeightS += span;
            _rippleLossJ += _spanLossJ;
            _rippleTimeS += span;
        }
        _settled = false;
    }

    /// <summary>Final scores at the end of the run.</summary>
    public TrackerScores Finish(double endS)
    {
        CloseRippleSpan(endS);
        CloseEvent();
        const double jPerWh = 3600.0;
        var windows = _settings.AllWindows.Select((w, k) => new WindowScore(
            w.Name, w.StartS, w.EndS, w.SlopeWm2PerS, _windowEnergyJ[k] / jPerWh, _windowAvailableJ[k] / jPerWh,
            _windowAvailableJ[k] > 0 ? _windowEnergyJ[k] / _windowAvailableJ[k] : null)).ToList();
        var groups = _settings.AllWindows.Select((w, k) => (w, k)).Where(x => x.w.Group is not null)
            .GroupBy(x => x.w.Group!)
            .Select(g =>
            {
                double e = g.Sum(x => _windowEnergyJ[x.k]), a = g.Sum(x => _windowAvailableJ[x.k]);
                return new WindowScore(g.Key, g.Min(x => x.w.StartS), g.Max(x => x.w.EndS), null, e / jPerWh, a / jPerWh, a > 0 ? e / a : null);
            }).ToList();
        var settled = _settling.Where(s => s.SettlingTimeS is not null).Select(s => s.SettlingTimeS!.Value).ToList();
        return new TrackerScores
        {
            TrackingEfficiency = Ratio(_energyJ.Value, _availableJ.Value),
            StaticEfficiency = _staticAvailableJ > 0 ? _staticEnergyJ / _staticAvailableJ : null,
            EnergyWh = _energyJ.Value / jPerWh,
            AvailableEnergyWh = _availableJ.Value / jPerWh,
            StartupTimeS = _settling.Count > 0 && _settling[0].Label == StartupLabel ? _settling[0].SettlingTimeS : null,
            MeanSettlingTimeS = settled.Count > 0 ? settled.Average() : null,
            WorstSettlingTimeS = settled.Count > 0 ? settled.Max() : null,
            EventsNeverSettled = _settling.Count - settled.Count,
            Settling = _settling.ToList(),
            RippleVoltagePeakToPeakV = _rippleWeightS > 0 ? _rippleVSum / _rippleWeightS : null,
            RipplePowerPeakToPeakW = _rippleWeightS > 0 ? _ripplePSum / _rippleWeightS : null,
            RippleMeanLossW = _rippleTimeS > 0 ? _rippleLossJ / _rippleTimeS : null,
            MultiPeakTimeS = _multiPeakS,
            GlobalPeakTimeShare = _multiPeakS > 0 ? _onGlobalS / _multiPeakS : null,
            LowerPeakEnergyLostWh = _lowerLossJ / jPerWh,
            ExcursionEnergyLostWh = _excursionLossJ / jPerWh,
            ExcursionTimeS = _excursionTimeS,
            Windows = windows,
            Groups = groups,
            EnergySplit = Split(),
            Stall = Stall(),
        };
    }

    private static double Ratio(double e, double a) => a > 0 ? e / a : 0.0;
}
