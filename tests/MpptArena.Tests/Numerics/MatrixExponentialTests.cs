using MpptArena.Numerics;

namespace MpptArena.Tests.Numerics;

public class MatrixExponentialTests
{
    /// <summary>exp(A t) by its defining power series with scaling and squaring (Moler and Van Loan, SIAM Review 20(4), 1978, methods 1 and 3).</summary>
    private static double[,] SeriesExponential(double a11, double a12, double a21, double a22, double t)
    {
        double norm = Math.Abs(a11 * t) + Math.Abs(a12 * t) + Math.Abs(a21 * t) + Math.Abs(a22 * t);
        int squarings = Math.Max(0, (int)Math.Ceiling(Math.Log2(norm + 1e-300)) + 4);
        double s = t / Math.Pow(2, squarings);
        double[,] m = { { a11 * s, a12 * s }, { a21 * s, a22 * s } };
        double[,] sum = { { 1, 0 }, { 0, 1 } }, term = { { 1, 0 }, { 0, 1 } };
        for (int k = 1; k <= 30; k++)
        {
            term = Multiply(term, m);
            for (int i = 0; i < 2; i++) for (int j = 0; j < 2; j++) term[i, j] /= k;
            for (int i = 0; i < 2; i++) for (int j = 0; j < 2; j++) sum[i, j] += term[i, j];
        }
        for (int q = 0; q < squarings; q++) sum = Multiply(sum, sum);
        return sum;
    }

    private static double[,] Multiply(double[,] x, double[,] y) => new double[,]
    {
        { x[0, 0] * y[0, 0] + x[0, 1] * y[1, 0], x[0, 0] * y[0, 1] + x[0, 1] * y[1, 1] },
        { x[1, 0] * y[0, 0] + x[1, 1] * y[1, 0], x[1, 0] * y[0, 1] + x[1, 1] * y[1, 1] },
    };

    [Fact]
    public void SkewMatrixGivesTheRotation()
    {
        // exp([[0, w], [-w, 0]] t) = [[cos wt, sin wt], [-sin wt, cos wt]] (textbook identity).
        var e = MatrixExponential2.Of(0, 2, -2, 0, 0.7);
        Assert.Equal(Math.Cos(1.4), e.A11, 14);
        Assert.Equal(Math.Sin(1.4), e.A12, 14);
        Assert.Equal(-Math.Sin(1.4), e.A21, 14);
        Assert.Equal(Math.Cos(1.4), e.A22, 14);
    }

    [Fact]
    public void JordanBlockGivesTheSecularTerm()
    {
        // exp([[l, 1], [0, l]] t) = exp(l t) [[1, t], [0, 1]] (textbook identity; the double-eigenvalue branch).
        var e = MatrixExponential2.Of(-3, 1, 0, -3, 0.4);
        double d = Math.Exp(-1.2);
        Assert.Equal(d, e.A11, 14);
        Assert.Equal(0.4 * d, e.A12, 14);
        Assert.Equal(0.0, e.A21, 14);
        Assert.Equal(d, e.A22, 14);
    }

    [Theory]
    [InlineData(-628.3, -4545.5, 1.2e5, -6300.0, 1e-3)]    // the boost loop's matrix: stiff, real eigenvalues
    [InlineData(-628.3, -4545.5, -9000.0, -6300.0, 2e-4)]
    [InlineData(-50.0, 400.0, -400.0, -10.0, 5e-3)]         // lightly damped oscillation
    [InlineData(0.3, -1.1, 0.8, -0.2, 2.0)]
    [InlineData(-1.0, 1e-9, 1e-9, -1.0000001, 0.5)]          // nearly a double eigenvalue
    public void MatchesTheDefiningSeries(double a11, double a12, double a21, double a22, double t)
    {
        var e = MatrixExponential2.Of(a11, a12, a21, a22, t);
        var r = SeriesExponential(a11, a12, a21, a22, t);
        double scale = Math.Max(1e-12, Math.Max(Math.Max(Math.Abs(r[0, 0]), Math.Abs(r[0, 1])), Math.Max(Math.Abs(r[1, 0]), Math.Abs(r[1, 1]))));
        Assert.Equal(r[0, 0], e.A11, scale * 1e-11);
        Assert.Equal(r[0, 1], e.A12, scale * 1e-11);
        Assert.Equal(r[1, 0], e.A21, scale * 1e-11);
        Assert.Equal(r[1, 1], e.A22, scale * 1e-11);
    }
}
