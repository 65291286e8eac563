namespace MpptArena.Numerics;

/// <summary>
/// Piecewise-cubic Hermite interpolation with slopes limited so that monotone data stay monotone.
/// </summary>
/// <remarks>F. N. Fritsch, R. E. Carlson, "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal.
/// 17(2), 1980, 238-246: with secant delta_k, alpha = m_k/delta_k and beta = m_{k+1}/delta_k, keeping
/// (alpha, beta) inside the circle alpha^2 + beta^2 &lt;= 9 preserves monotonicity.</remarks>
public static class MonotoneHermite
{
    /// <summary>Value of the cubic on an interval of width h at t in [0, 1].</summary>
    public static double Value(double t, double h, double y0, double y1, double m0, double m1)
    {
        double t2 = t * t, t3 = t2 * t;
        return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * h * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * h * m1;
    }

    /// <summary>Derivative dy/dx of the cubic at t.</summary>
    public static double Slope(double t, double h, double y0, double y1, double m0, double m1)
    {
        double t2 = t * t;
        return ((6 * t2 - 6 * t) * (y0 - y1)) / h + (3 * t2 - 4 * t + 1) * m0 + (3 * t2 - 2 * t) * m1;
    }

    /// <summary>Limits the slopes in place (Fritsch and Carlson 1980, the circle condition).</summary>
    /// <param name="x">Abscissae, strictly increasing.</param>
    /// <param name="y">Ordinates, monotone.</param>
    /// <param name="m">Slopes dy/dx at the nodes; changed in place.</param>
    public static void LimitSlopes(double[] x, double[] y, double[] m) => LimitSlopes(x.AsSpan(), y, m);

    /// <summary>The same on spans of equal length.</summary>
    public static void LimitSlopes(ReadOnlySpan<double> x, ReadOnlySpan<double> y, Span<double> m)
    {
        for (int k = 0; k + 1 < x.Length; k++)
        {
            double delta = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
            if (delta == 0)
            {
                m[k] = 0;
                m[k + 1] = 0;
                continue;
            }
            double alpha = m[k] / delta, beta = m[k + 1] / delta;
            if (alpha < 0) { m[k] = 0; alpha = 0; }
            if (beta < 0) { m[k + 1] = 0; beta = 0; }
            double r = alpha * alpha + beta * beta;
            if (r > 9)
            {
                double tau = 3 / Math.Sqrt(r);
                m[k] = tau * alpha * delta;
                m[k + 1] = tau * beta * delta;
            }
        }
    }
}
