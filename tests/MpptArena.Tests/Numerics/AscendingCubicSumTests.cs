using MpptArena.Numerics;
using MpptArena.Sensing;

namespace MpptArena.Tests.Numerics;

public class AscendingCubicSumTests
{
    /// <summary>A piecewise cubic through a cubic polynomial's exact values and slopes at the given nodes.</summary>
    private static PiecewiseCubic Interpolating(double[] coefficients, double[] nodes)
    {
        var y = nodes.Select(x => Polynomial(coefficients, x, out _)).ToArray();
        var m = nodes.Select(x => { Polynomial(coefficients, x, out double s); return s; }).ToArray();
        return new PiecewiseCubic(nodes, y, m);
    }

    private static double Polynomial(double[] c, double x, out double slope)
    {
        slope = c[1] + x * (2 * c[2] + 3 * c[3] * x);
        return c[0] + x * (c[1] + x * (c[2] + x * c[3]));
    }

    [Fact]
    public void SumOfInterpolatedCubicsIsTheSumOfTheCubicsThroughClusteredBreakpoints()
    {
        // Cubic Hermite interpolation reproduces a cubic polynomial exactly (its error term carries the fourth
        // derivative: Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980; any numerical-analysis text), so
        // the sweep over 25 such interpolants must give the closed-form sum of the cubics. Each interpolant
        // has a cluster of very short pieces (down to 1e-9 wide, where divided differences lose most digits)
        // so that the carried coefficients are tested where their rounding is worst.
        var random = new DeterministicRandom(11UL);
        int terms = 25;
        var cubics = new PiecewiseCubic[terms];
        var weights = new double[terms];
        var coefficients = new double[terms][];
        for (int k = 0; k < terms; k++)
        {
            coefficients[k] = [20 * random.NextDouble() - 10, 40 * random.NextDouble() - 20, 6 * random.NextDouble() - 3, random.NextDouble() - 0.5];
            var nodes = new SortedSet<double> { -5.0, 10.0 };
            for (int j = 0; j < 30; j++) nodes.Add(-5 + 15 * random.NextDouble());
            double cluster = 9 * random.NextDouble() - 3;
            for (int j = 1; j <= 12; j++) nodes.Add(cluster + Math.Pow(10, -j * 0.75));
            cubics[k] = Interpolating(coefficients[k], [.. nodes]);
            weights[k] = 1 + (k % 3);
        }
        var sum = new AscendingCubicSum(cubics, weights, -4.0, 1e-9, 1e-9);
        int checkedPoints = 0;
        double worstValue = 0, worstSlope = 0;
        void Check()
        {
            double value = 0, slope = 0;
            for (int k = 0; k < terms; k++)
            {
                value += weights[k] * Polynomial(coefficients[k], sum.X, out double s);
                slope += weights[k] * s;
            }
            worstValue = Math.Max(worstValue, Math.Abs(sum.Value - value));
            worstSlope = Math.Max(worstSlope, Math.Abs(sum.Slope - slope));
            checkedPoints++;
        }
        Check();
        while (sum.NextBreakpoint < 9.5)
        {
            // Inside a piece shorter than a thousandth even the closed form's own rounding (x^3 of values
            // near 1e3 to 1e-16) is not small next to the budget, so points between nodes are checked only
            // in wider pieces; every node is checked.
            double gap = sum.NextBreakpoint - sum.X;
            if (gap > 1e-3)
            {
                sum.MoveTo(sum.X + 0.5 * gap);
                Check();
            }
            sum.CrossNextBreakpoint();
            Check();
        }
        Assert.True(checkedPoints > 1000, $"{checkedPoints} points");
        // Rounding of a direct evaluation is about 1e-13 here; the budget was 1e-9.
        Assert.True(worstValue < 2e-9, $"worst value error {worstValue:E2}");
        Assert.True(worstSlope < 2e-9, $"worst slope error {worstSlope:E2}");
        // The point of the sweep: far fewer fresh evaluations of all terms than breakpoints crossed.
        Assert.True(sum.FreshEvaluations < checkedPoints / 4, $"{sum.FreshEvaluations} fresh evaluations for {checkedPoints} points");
    }

    [Fact]
    public void SweepMatchesDirectEvaluationOfKneeShapedTables()
    {
        // Terms shaped like substring characteristics near a bypass knee: f(x) = -s ln(1 + exp((x - c)/s)),
        // flat below the knee c and falling with slope -1 above it, with all its bend within a few s = 1e-4.
        // Tabulated with nodes packed geometrically on both sides of the knee, so pieces range from 1e-8
        // to a few units. At every node the sweep must give the sum of the terms' node values and slopes,
        // which is what summing direct evaluations gives there (the sum the sweep replaces).
        var random = new DeterministicRandom(5UL);
        int terms = 30;
        const double width = 1e-4;
        var cubics = new PiecewiseCubic[terms];
        var weights = new double[terms];
        for (int k = 0; k < terms; k++)
        {
            double knee = 1 + 8 * random.NextDouble();
            var nodes = new SortedSet<double> { -45.0, -40.0, 0.0, 15.0, 20.0 };
            for (int j = -8; j <= 40; j++)
            {
                double offset = Math.Pow(10, -j / 8.0);
                nodes.Add(knee + offset);
                nodes.Add(knee - offset);
            }
            var x = nodes.ToArray();
            var y = x.Select(v => -width * Softplus((v - knee) / width)).ToArray();
            var m = x.Select(v => -1 / (1 + Math.Exp(-(v - knee) / width))).ToArray();
            cubics[k] = new PiecewiseCubic(x, y, m);
            weights[k] = 1 + k % 2;
        }
        var sum = new AscendingCubicSum(cubics, weights, -42.0, 1e-9, 1e-9);
        double worst = 0;
        while (sum.NextBreakpoint < 20)
        {
            sum.CrossNextBreakpoint();
            double direct = 0, directSlope = 0;
            for (int k = 0; k < terms; k++)
            {
                direct += weights[k] * cubics[k].Evaluate(sum.X, out double s);
                directSlope += weights[k] * s;
            }
            worst = Math.Max(worst, Math.Abs(sum.Value - direct));
            Assert.True(Math.Abs(sum.Slope - directSlope) <= 1e-9 + 1e-12 * Math.Abs(directSlope), $"slope {sum.Slope} vs {directSlope} at {sum.X}");
        }
        Assert.True(worst < 2e-9, $"worst value error {worst:E2}");
    }

    /// <summary>ln(1 + e^z) without overflow.</summary>
    private static double Softplus(double z) => z > 0 ? z + Math.Log(1 + Math.Exp(-z)) : Math.Log(1 + Math.Exp(z));

    [Fact]
    public void RefusesToMoveBackwardsOrPastABreakpoint()
    {
        var cubic = Interpolating([1, 2, 3, 4], [0, 1, 2]);
        var sum = new AscendingCubicSum([cubic], [1.0], 0.5, 1e-9, 1e-9);
        Assert.Throws<ArgumentOutOfRangeException>(() => sum.MoveTo(0.4));
        Assert.Throws<ArgumentOutOfRangeException>(() => sum.MoveTo(1.5));
    }
}
