using MathNet.Numerics.Distributions;
using MpptArena.Sensing;

namespace MpptArena.Tests.Sensing;

public class NoiseTests
{
    private static double[] Draw(ulong seed, int n)
    {
        var random = new DeterministicRandom(seed);
        var z = new double[n];
        for (int k = 0; k < n; k++) z[k] = random.NextGaussian();
        return z;
    }

    [Fact]
    public void NormalDeviatesPassTheKolmogorovSmirnovTestAgainstMathNetsNormal()
    {
        // Reference CDF: MathNet.Numerics.Distributions.Normal. Critical value of the one-sample
        // Kolmogorov-Smirnov statistic at alpha = 0.01 for large n: 1.63 / sqrt(n)
        // (F. J. Massey, "The Kolmogorov-Smirnov test for goodness of fit", JASA 46(253), 1951, table 1).
        const int n = 200_000;
        var z = Draw(17, n);
        Array.Sort(z);
        double d = 0;
        for (int k = 0; k < n; k++)
        {
            double f = Normal.CDF(0, 1, z[k]);
            d = Math.Max(d, Math.Max((k + 1.0) / n - f, f - (double)k / n));
        }
        Assert.True(d < 1.63 / Math.Sqrt(n), $"D = {d:G4}, critical {1.63 / Math.Sqrt(n):G4}");
        double mean = z.Average(), variance = z.Select(x => (x - mean) * (x - mean)).Sum() / (n - 1);
        // Five standard errors: mean 1/sqrt(n), sample variance sqrt(2/n) for normal data.
        Assert.True(Math.Abs(mean) < 5 / Math.Sqrt(n), $"mean {mean:G4}");
        Assert.True(Math.Abs(variance - 1) < 5 * Math.Sqrt(2.0 / n), $"variance {variance:G6}");
    }

    [Fact]
    public void TheFarTailHasTheNormalsMassAndConditionalMean()
    {
        // The rarest path (beyond r = 3.4426, Marsaglia and Tsang 2000) must still give the normal tail:
        // P(|Z| > r) = 2 (1 - Phi(r)) and E[|Z| | |Z| > r] = phi(r) / (1 - Phi(r)) (Mills ratio; reference values from MathNet).
        const int n = 2_000_000;
        const double r = 3.442619855899;
        var z = Draw(23, n);
        var tail = z.Where(x => Math.Abs(x) > r).Select(Math.Abs).ToArray();
        double p = 2 * (1 - Normal.CDF(0, 1, r));
        double expectedCount = p * n, sigmaCount = Math.Sqrt(n * p * (1 - p));
        Assert.True(Math.Abs(tail.Length - expectedCount) < 5 * sigmaCount, $"{tail.Length} beyond r, expected {expectedCount:F0} +/- {sigmaCount:F0}");
        double expectedMean = Normal.PDF(0, 1, r) / (1 - Normal.CDF(0, 1, r));
        double spread = Math.Sqrt(tail.Select(x => (x - expectedMean) * (x - expectedMean)).Average());
        Assert.True(Math.Abs(tail.Average() - expectedMean) < 5 * spread / Math.Sqrt(tail.Length), $"tail mean {tail.Average():G5}, expected {expectedMean:G5}");
        // Both signs, equally (a binomial with p = 1/2).
        int negative = z.Count(x => x < 0);
        Assert.True(Math.Abs(negative - n / 2.0) < 5 * Math.Sqrt(n / 4.0));
    }

    [Fact]
    public void SameSeedSameNoiseAndDifferentStreamsDiffer()
    {
        Assert.Equal(Draw(5, 1000), Draw(5, 1000));
        var a = Draw(DeterministicRandom.Derive(5, 1), 1000);
        var b = Draw(DeterministicRandom.Derive(5, 2), 1000);
        // Two independent standard normal streams: their sample correlation over 1000 pairs is within 5/sqrt(1000).
        double correlation = a.Zip(b, (x, y) => x * y).Average();
        Assert.True(Math.Abs(correlation) < 5 / Math.Sqrt(1000));
    }

    [Fact]
    public void NoiseFreeConversionRoundsToTheNearestCodeAndClampsAtTheRails()
    {
        // A 12-bit converter over 0..409.6 V has 0.1 V steps; round to nearest (common practice for a SAR ADC
        // with half-LSB offset), codes 0..4095.
        var adc = new AdcChannel(new AdcChannelSettings(12, 409.6), 1);
        Assert.Equal(0.1, adc.Settings.LeastSignificantBit, 15);
        Assert.Equal(123, adc.Convert(12.34));
        Assert.Equal(124, adc.Convert(12.36));
        Assert.Equal(0, adc.Convert(-3.0));
        Assert.Equal(4095, adc.Convert(1000.0));
        var withErrors = new AdcChannel(new AdcChannelSettings(12, 409.6, GainError: 0.01, Offset: -0.5), 1);
        Assert.Equal((long)Math.Round((100.0 * 1.01 - 0.5) / 0.1), withErrors.Convert(100.0));
    }

    [Fact]
    public void QuantisedNoiseHasTheInputNoisePlusOneTwelfthOfAStepSquared()
    {
        // With input noise of several steps, quantisation adds variance q^2/12 independent of the signal
        // (B. Widrow, I. Kollar, Quantization Noise, Cambridge University Press 2008, ch. 4 and 5).
        const int n = 100_000;
        double q = 0.1, sigma = 0.3;
        var adc = new AdcChannel(new AdcChannelSettings(12, 4096 * q, NoiseRms: sigma), 99);
        double trueValue = 200.0137;
        var values = Enumerable.Range(0, n).Select(_ => adc.Convert(trueValue) * q).ToArray();
        double mean = values.Average();
        double variance = values.Select(v => (v - mean) * (v - mean)).Sum() / (n - 1);
        double expected = sigma * sigma + q * q / 12;
        Assert.True(Math.Abs(mean - trueValue) < 5 * Math.Sqrt(expected / n), $"mean {mean:G8}");
        Assert.True(Math.Abs(variance / expected - 1) < 5 * Math.Sqrt(2.0 / n), $"variance {variance:G5}, expected {expected:G5}");
    }
}
