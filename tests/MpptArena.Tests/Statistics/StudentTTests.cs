using MpptArena.Numerics;
using MpptArena.Statistics;

namespace MpptArena.Tests.Statistics;

public class StudentTTests
{
    [Theory]
    // Two-sided 95 % critical values t(0.975, nu), NIST/SEMATECH e-Handbook of Statistical Methods, sec. 1.3.6.7.2
    // (Critical values of the Student's t distribution), printed to three decimals.
    [InlineData(1, 12.706)]
    [InlineData(2, 4.303)]
    [InlineData(3, 3.182)]
    [InlineData(4, 2.776)]
    [InlineData(5, 2.571)]
    [InlineData(9, 2.262)]
    [InlineData(10, 2.228)]
    [InlineData(15, 2.131)]
    [InlineData(30, 2.042)]
    [InlineData(100, 1.984)]
    public void NinetyFivePercentQuantilesMatchTheHandbookTable(int nu, double table)
    {
        Assert.Equal(table, StudentT.TwoSidedQuantile(0.95, nu), 0.0006);
    }

    [Theory]
    [InlineData(0.95)]
    [InlineData(0.99)]
    [InlineData(0.5)]
    public void QuantilesAgreeWithMathNetToNineDigits(double coverage)
    {
        // Reference library: MathNet.Numerics' StudentT.InvCDF (regularised incomplete beta inversion).
        foreach (int nu in Enumerable.Range(1, 60).Concat([99, 250, 1000, 4999]))
        {
            double reference = MathNet.Numerics.Distributions.StudentT.InvCDF(0, 1, nu, 0.5 + coverage / 2);
            Assert.Equal(reference, StudentT.TwoSidedQuantile(coverage, nu), Math.Abs(reference) * 1e-9);
        }
    }

    [Fact]
    public void PortableArctangentAgreesWithTheRuntimeToAFewUlps()
    {
        var random = new Random(5);
        for (int k = 0; k < 20000; k++)
        {
            double x = Math.Tan((random.NextDouble() - 0.5) * Math.PI * 0.999999) * (k % 3 == 0 ? 1e-3 : 1);
            double reference = Math.Atan(x);
            // Reference: the runtime's arctangent (within 1 ulp); 1e-15 relative is about 4.5 ulps.
            Assert.True(Math.Abs(PortableMath.Atan(x) - reference) <= 1e-15 * Math.Abs(reference),
                $"atan({x:R}) = {PortableMath.Atan(x):R}, runtime {reference:R}");
        }
        Assert.Equal(Math.PI / 4, PortableMath.Atan(1), 1e-16);
        Assert.Equal(Math.PI / 2, PortableMath.Atan(double.PositiveInfinity));
    }

    [Fact]
    public void SampleSummaryGivesTheTextbookStudentInterval()
    {
        // Values 1..5: mean 3, s = sqrt(2.5); the interval 3 +/- t(0.975, 4) s / sqrt(5) with t(0.975, 4) from
        // MathNet (reference library), mean and s from MathNet's descriptive statistics.
        double[] values = [1, 2, 3, 4, 5];
        var s = SampleSummary.Of(values);
        double sd = MathNet.Numerics.Statistics.Statistics.StandardDeviation(values);
        double half = MathNet.Numerics.Distributions.StudentT.InvCDF(0, 1, 4, 0.975) * sd / Math.Sqrt(5);
        Assert.Equal(3.0, s.Mean, 1e-15);
        Assert.Equal(Math.Sqrt(2.5), s.StandardDeviation!.Value, 1e-15);
        Assert.Equal(sd, s.StandardDeviation!.Value, 1e-15);
        Assert.Equal(3 - half, s.ConfidenceLow!.Value, 1e-9);
        Assert.Equal(3 + half, s.ConfidenceHigh!.Value, 1e-9);
        Assert.Equal(1, s.Min);
        Assert.Equal(5, s.Max);
        Assert.False(s.IntervalHoldsZero);
        var one = SampleSummary.Of([0.9]);
        Assert.Null(one.StandardDeviation);
        Assert.Null(one.ConfidenceLow);
    }

    [Fact]
    public void PairedDifferencesCancelWhatBothSamplesShare()
    {
        // Common practice (paired t-test): a shared, seed-driven part cancels in the differences, so a small
        // consistent shift is found although it is far smaller than the spread of either sample.
        double[] shared = [0.90, 0.95, 0.86, 0.93, 0.88, 0.97, 0.91, 0.89];
        double[] baseline = shared;
        double[] current = shared.Select((v, k) => v - 0.001 + (k % 2 == 0 ? 1e-4 : -1e-4)).ToArray();
        var d = SampleSummary.OfDifferences(baseline, current);
        Assert.Equal(-0.001, d.Mean, 1e-12);
        Assert.True(d.ConfidenceHigh < 0);
        Assert.True(SampleSummary.Of(baseline).StandardDeviation > 0.03);
    }
}
