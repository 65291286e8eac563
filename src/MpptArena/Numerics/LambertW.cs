namespace MpptArena.Numerics;

/// <summary>The principal branch W0 of the Lambert W function and the Wright omega function.</summary>
/// <remarks>
/// W is the inverse of w e^w (R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey, D. E. Knuth,
/// "On the Lambert W function", Adv. Comput. Math. 5 (1996) 329-359). The Wright omega function
/// omega(z) = W(e^z) solves w + ln w = z and lets the single-diode model be evaluated where e^z
/// overflows a double (P. W. Lawrence, R. M. Corless, D. J. Jeffrey, "Algorithm 917: Complex
/// double-precision evaluation of the Wright omega function", ACM TOMS 38(3), 2012). Both are refined
/// with Halley's method from the series starting points given by Corless et al. (1996), sec. 4.
/// </remarks>
public static class LambertW
{
    private const double InverseE = 0.36787944117144233;
    private const int MaxIterations = 64;

    /// <summary>Principal branch W0(x) for x &gt;= -1/e.</summary>
    /// <param name="x">Argument [-].</param>
    /// <returns>W0(x), or NaN for x &lt; -1/e or NaN input.</returns>
    public static double W0(double x)
    {
        if (double.IsNaN(x) || x < -InverseE) return double.NaN;
        if (x == 0.0) return 0.0;
        if (double.IsPositiveInfinity(x)) return double.PositiveInfinity;
        if (x == -InverseE) return -1.0;
        if (x > 1e300) return WrightOmega(PortableMath.Log(x));

        double w;
        if (x < -0.3)
        {
            // Branch-point series (Corless et al. 1996, eq. 4.22): p = sqrt(2(e x + 1)).
            double p = Math.Sqrt(2.0 * (Math.E * x + 1.0));
            w = -1.0 + p - p * p / 3.0 + 11.0 / 72.0 * p * p * p;
        }
        else if (x < 3.0)
        {
            w = PortableMath.Log(1.0 + x) * (1.0 - PortableMath.Log(1.0 + PortableMath.Log(1.0 + x)) / (2.0 + PortableMath.Log(1.0 + x)));
        }
        else
        {
            // Asymptotic series (Corless et al. 1996, eq. 4.19).
            double l1 = PortableMath.Log(x), l2 = PortableMath.Log(l1);
            w = l1 - l2 + l2 / l1;
        }
        return HalleyOnProduct(x, w);
    }

    /// <summary>Wright omega function omega(z) = W0(e^z), the real solution of w + ln w = z.</summary>
    /// <param name="z">Argument [-], any real number.</param>
    /// <returns>omega(z) &gt; 0; underflows to e^z for very negative z.</returns>
    public static double WrightOmega(double z)
    {
        if (double.IsNaN(z)) return double.NaN;
        if (double.IsPositiveInfinity(z)) return double.PositiveInfinity;
        if (z < -30.0)
        {
            // omega = e^z (1 - e^z + ...): the correction is below double precision here.
            double e = PortableMath.Exp(z);
            return e * (1.0 - e);
        }
        double w;
        if (z < 1.0)
        {
            // Winitzki's approximation of W0(x), x = e^z (S. Winitzki, "Uniform approximations for
            // transcendental functions", ICCSA 2003), good to about 1e-2 relative here.
            double l = PortableMath.Log(1.0 + PortableMath.Exp(z));
            w = l * (1.0 - PortableMath.Log(1.0 + l) / (2.0 + l));
        }
        else
        {
            // omega ~ z - ln z + ln z / z (Lawrence, Corless, Jeffrey 2012, sec. 3).
            double lz = PortableMath.Log(z);
            w = z - lz + lz / z;
        }
        // Fourth-order iteration of Fritsch, Shafer and Crowley (Comm. ACM 16(2), 1973), as used by
        // Algorithm 917: each step roughly quadruples the number of correct digits.
        for (int i = 0; i < 6; i++)
        {
            double r = z - w - PortableMath.Log(w);
            double wp1 = w + 1.0;
            double u = 2.0 * wp1 * (wp1 + 2.0 / 3.0 * r);
            double next = w * (1.0 + r / wp1 * (u - r) / (u - 2.0 * r));
            if (Math.Abs(next - w) <= 2e-16 * next) return next;
            w = next;
        }
        return w;
    }

    /// <summary>Halley's method on f(w) = w e^w - x (Corless et al. 1996, eq. 5.9).</summary>
    private static double HalleyOnProduct(double x, double w)
    {
        for (int i = 0; i < MaxIterations; i++)
        {
            double ew = PortableMath.Exp(w);
            double f = w * ew - x;
            double wp1 = w + 1.0;
            if (wp1 == 0.0) return w;
            double denominator = ew * wp1 - (w + 2.0) * f / (2.0 * wp1);
            double next = w - f / denominator;
            if (Math.Abs(next - w) <= 4e-16 * (1.0 + Math.Abs(next))) return next;
            w = next;
        }
        return w;
    }
}
