namespace MpptArena.Sensing;

/// <summary>How one measured quantity reaches the tracker: conditioning errors, noise, averaging, quantisation.</summary>
/// <param name="Bits">ADC resolution [bits].</param>
/// <param name="FullScale">Input that gives the top code [V or A].</param>
/// <param name="GainError">Relative gain error [-], e.g. 0.005 for +0.5 %.</param>
/// <param name="Offset">Offset error [V or A].</param>
/// <param name="NoiseRms">Gaussian noise on each conversion, RMS [V or A].</param>
/// <param name="AveragingSamples">Conversions averaged per tracker sample [-].</param>
/// <param name="AveragingWindowS">Time span of those conversions, ending at the sample instant [s].</param>
public sealed record AdcChannelSettings(
    int Bits, double FullScale, double GainError = 0, double Offset = 0, double NoiseRms = 0,
    int AveragingSamples = 1, double AveragingWindowS = 0)
{
    /// <summary>Size of one code step [V or A].</summary>
    public double LeastSignificantBit => FullScale / (1L << Bits);

    /// <summary>Largest code.</summary>
    public long MaxCode => (1L << Bits) - 1;

    /// <summary>An ADC that passes the true value through (for tests of the algorithms alone).</summary>
    public static AdcChannelSettings Ideal(double fullScale) => new(24, fullScale);
}
