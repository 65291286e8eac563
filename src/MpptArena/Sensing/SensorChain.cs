namespace MpptArena.Sensing;

/// <summary>
/// The voltage and current ADC channels of one tracker with their averaging schedule: the N
/// conversions of one tracker sample are spread evenly over the averaging window that ends at the
/// sample instant, each at the plant step nearest its time (several at one step when the window is
/// shorter than N plant steps; each conversion still draws its own noise). The current channel reads the
/// PV or the inductor current; with ripple on, each conversion samples the switching waveform at its
/// phase (<see cref="RippleSettings"/>; free-running phases from a stream of their own).
/// </summary>
public sealed class SensorChain
{
    private readonly AdcChannel _voltage, _current;
    private readonly bool _inductor;
    private readonly RippleSettings? _ripple;
    private readonly DeterministicRandom? _phases;
    private readonly int[] _conversionsAtStep;
    private long _vSum, _iSum;
    private int _count;

    /// <summary>A chain for a tracker whose sample period is <paramref name="stepsPerSample"/> plant steps of <paramref name="plantStepS"/>.</summary>
    public SensorChain(SensorSettings settings, int stepsPerSample, double plantStepS, ulong seed)
    {
        _voltage = new AdcChannel(settings.Voltage, DeterministicRandom.Derive(seed, 1));
        _current = new AdcChannel(settings.Current, DeterministicRandom.Derive(seed, 2));
        _inductor = settings.CurrentMeasures == CurrentSignal.InductorCurrent;
        _ripple = settings.Ripple;
        if (_ripple is { CarrierTriggered: false }) _phases = new DeterministicRandom(DeterministicRandom.Derive(seed, 3));
        _conversionsAtStep = new int[stepsPerSample];
        int n = Math.Max(1, Math.Max(settings.Voltage.AveragingSamples, settings.Current.AveragingSamples));
        double window = Math.Max(settings.Voltage.AveragingWindowS, settings.Current.AveragingWindowS);
        for (int j = 0; j < n; j++)
        {
            int back = n == 1 ? 0 : (int)Math.Round(j * window / (n - 1) / plantStepS);
            back = Math.Clamp(back, 0, stepsPerSample - 1);
            _conversionsAtStep[stepsPerSample - 1 - back]++;
        }
    }

    /// <summary>Called at every plant step with its index within the sample period (0-based; the last index is the sample instant).</summary>
    public void OnPlantStep(int stepInSample, double trueVoltageV, double trueCurrentA)
    {
        for (int k = _conversionsAtStep[stepInSample]; k > 0; k--)
        {
            _vSum += _voltage.Convert(trueVoltageV);
            _iSum += _current.Convert(trueCurrentA);
            _count++;
        }
    }

    /// <summary>
    /// As <see cref="OnPlantStep(int, double, double)"/>, reading the front end only when a conversion is
    /// due: its period means, or with ripple on its instantaneous values at each conversion's phase.
    /// </summary>
    public void OnPlantStep(int stepInSample, Plant.IFrontEnd frontEnd)
    {
        int due = _conversionsAtStep[stepInSample];
        if (due == 0) return;
        if (_ripple is null)
        {
            OnPlantStep(stepInSample, frontEnd.PvVoltageV, _inductor ? frontEnd.InductorCurrentA : frontEnd.PvCurrentA);
            return;
        }
        for (int k = due; k > 0; k--)
        {
            double phase = _phases?.NextDouble() ?? _ripple.PhaseFraction;
            var (v, ipv, inductor) = frontEnd.InstantAt(phase);
            _vSum += _voltage.Convert(v);
            _iSum += _current.Convert(_inductor ? inductor : ipv);
            _count++;
        }
    }

    /// <summary>Averaged codes and scaled values of the sample just completed; clears the sums.</summary>
    public (double VoltageCode, double CurrentCode, double VoltageV, double CurrentA, int Conversions) TakeSample()
    {
        int n = _count;
        double vc = n > 0 ? (double)_vSum / n : 0, ic = n > 0 ? (double)_iSum / n : 0;
        _vSum = _iSum = 0;
        _count = 0;
        return (vc, ic, _voltage.Scale(vc), _current.Scale(ic), n);
    }
}
