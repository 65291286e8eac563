namespace MpptArena.Sensing;

/// <summary>
/// One ADC channel: each conversion takes the true value, applies gain and offset error, adds seeded
/// Gaussian noise, and quantises to an unsigned code clamped to the range (round to nearest, as a
/// successive-approximation converter with half-LSB offset does). Averaging happens on the codes, as
/// firmware that sums conversions does.
/// </summary>
public sealed class AdcChannel
{
    private readonly AdcChannelSettings _settings;
    private readonly DeterministicRandom _random;
    // The settings' values, read once: a conversion runs several times per tracker sample.
    private readonly double _gain, _offset, _noiseRms, _lsb, _maxCode;

    /// <summary>A channel with its own noise stream.</summary>
    public AdcChannel(AdcChannelSettings settings, ulong seed)
    {
        _settings = settings;
        _random = new DeterministicRandom(seed);
        _gain = 1.0 + settings.GainError;
        _offset = settings.Offset;
        _noiseRms = settings.NoiseRms;
        _lsb = settings.LeastSignificantBit;
        _maxCode = settings.MaxCode;
    }

    /// <summary>The channel's settings.</summary>
    public AdcChannelSettings Settings => _settings;

    /// <summary>One conversion of <paramref name="trueValue"/> [V or A] to a code.</summary>
    public long Convert(double trueValue)
    {
        double x = trueValue * _gain + _offset;
        if (_noiseRms > 0) x += _noiseRms * _random.NextGaussian();
        double code = Math.Round(x / _lsb, MidpointRounding.AwayFromZero);
        return (long)Math.Clamp(code, 0, _maxCode);
    }

    /// <summary>Scaled value [V or A] of an averaged code.</summary>
    public double Scale(double averageCode) => averageCode * _lsb;
}
