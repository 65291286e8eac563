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

    /// <summary>A channel with its own noise stream.</summary>
    public AdcChannel(AdcChannelSettings settings, ulong seed)
    {
        _settings = settings;
        _random = new DeterministicRandom(seed);
    }

    /// <summary>The channel's settings.</summary>
    public AdcChannelSettings Settings => _settings;

    /// <summary>One conversion of <paramref name="trueValue"/> [V or A] to a code.</summary>
    public long Convert(double trueValue)
    {
        double x = trueValue * (1.0 + _settings.GainError) + _settings.Offset;
        if (_settings.NoiseRms > 0) x += _settings.NoiseRms * _random.NextGaussian();
        double code = Math.Round(x / _settings.LeastSignificantBit, MidpointRounding.AwayFromZero);
        return (long)Math.Clamp(code, 0, _settings.MaxCode);
    }

    /// <summary>Scaled value [V or A] of an averaged code.</summary>
    public double Scale(double averageCode) => averageCode * _settings.LeastSignificantBit;
}
