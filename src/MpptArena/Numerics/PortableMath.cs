namespace MpptArena.Numerics;

/// <summary>
/// exp, log, expm1, cosh, sin and cos computed from IEEE 754 basic operations (+, -, *, / and bit
/// manipulation) only, so that every machine returns the same bits. .NET's <see cref="Math.Exp"/> and
/// its kin call the platform's C library, whose last bits differ between libraries (glibc, the Windows
/// CRT, Apple's libm) and even between processors under one library (glibc picks fused multiply-add code
/// at run time); a simulation that must give the same numbers on any machine cannot use them. The .NET JIT
/// does not fuse a*b+c on its own, so the code below rounds the same way everywhere.
/// </summary>
/// <remarks>
/// Algorithms and coefficients of fdlibm (Sun Microsystems, 1993; K. C. Ng and colleagues): e_exp.c
/// (reduction by k ln2 in two parts and a degree-5 Remez approximation of r (e^r + 1)/(e^r - 1)), e_log.c
/// (reduction to [sqrt(2)/2, sqrt(2)] and a degree-14 Remez series in s = f/(2 + f)), k_sin.c and k_cos.c
/// (kernels on [-pi/4, pi/4]), and the Cody-Waite branch of e_rem_pio2.c (pi/2 in three parts). fdlibm
/// documents errors below one unit in the last place. expm1 by W. Kahan's formula
/// (e^x - 1) x / ln(e^x) (N. J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002,
/// section 1.14.1), which keeps full relative accuracy near zero.
/// </remarks>
public static class PortableMath
{
    private const double Ln2Hi = 6.93147180369123816490e-01, Ln2Lo = 1.90821492927058770002e-10;
    private const double InvLn2 = 1.44269504088896338700e+00;
    private const double Ln10 = 2.30258509299404568402e+00;

    /// <summary>e^x.</summary>
    public static double Exp(double x)
    {
        const double P1 = 1.66666666666666019037e-01, P2 = -2.77777777770155933842e-03, P3 = 6.61375632143793436117e-05;
        const double P4 = -1.65339022054652515390e-06, P5 = 4.13813679705723846039e-08;
        const double OverflowAbove = 7.09782712893383973096e+02, UnderflowBelow = -7.45133219101941108420e+02;
        int hx = HighWord(x) & 0x7fffffff;
        bool negative = x < 0;
        if (hx >= 0x40862E42)
        {
            // |x| >= 709.78: overflow, underflow, infinity or NaN.
            if (double.IsNaN(x)) return x;
            if (x > OverflowAbove) return double.PositiveInfinity;
            if (x < UnderflowBelow) return 0.0;
        }
        double hi = 0, lo = 0, r;
        int k = 0;
        if (hx > 0x3fd62e42)
        {
            // |x| > ln2/2: x = k ln2 + r with |r| <= ln2/2, k ln2 carried in two parts.
            if (hx < 0x3FF0A2B2)
            {
                // |x| < 1.5 ln2: k = +-1.
                hi = negative ? x + Ln2Hi : x - Ln2Hi;
                lo = negative ? -Ln2Lo : Ln2Lo;
                k = negative ? -1 : 1;
            }
            else
            {
                k = (int)(InvLn2 * x + (negative ? -0.5 : 0.5));
                double t = k;
                hi = x - t * Ln2Hi;
                lo = t * Ln2Lo;
            }
            r = hi - lo;
        }
        else if (hx < 0x3e300000)
        {
            return 1.0 + x; // |x| < 2^-28
        }
        else
        {
            r = x;
        }
        double rr = r * r;
        double c = r - rr * (P1 + rr * (P2 + rr * (P3 + rr * (P4 + rr * P5))));
        if (k == 0) return 1.0 - ((r * c) / (c - 2.0) - r);
        double y = 1.0 - ((lo - (r * c) / (2.0 - c)) - hi);
        // y 2^k by adding k to the exponent field; below the normal range in two steps.
        if (k >= -1021) return BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(y) + ((long)k << 52));
        return BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(y) + ((long)(k + 1000) << 52)) * 9.33263618503218878990e-302;
    }

    /// <summary>Natural logarithm ln x (NaN for x &lt; 0, -infinity at 0).</summary>
    public static double Log(double x)
    {
        const double Lg1 = 6.666666666666735130e-01, Lg2 = 3.999999999940941908e-01, Lg3 = 2.857142874366239149e-01;
        const double Lg4 = 2.222219843214978396e-01, Lg5 = 1.818357216161805012e-01, Lg6 = 1.531383769920937332e-01;
        const double Lg7 = 1.479819860511658591e-01;
        const double Two54 = 1.80143985094819840000e+16;
        long bits = BitConverter.DoubleToInt64Bits(x);
        int hx = (int)(bits >> 32);
        int k = 0;
        if (hx < 0x00100000)
        {
            // x < 2^-1022: zero, negative or subnormal.
            if ((bits & 0x7fffffffffffffffL) == 0) return double.NegativeInfinity;
            if (hx < 0) return double.NaN;
            k -= 54;
            x *= Two54;
            bits = BitConverter.DoubleToInt64Bits(x);
            hx = (int)(bits >> 32);
        }
        if (hx >= 0x7ff00000) return x + x;
        k += (hx >> 20) - 1023;
        hx &= 0x000fffff;
        // Normalise the mantissa into [sqrt(2)/2, sqrt(2)): x or x/2.
        int i = (hx + 0x95f64) & 0x100000;
        x = WithHighWord(x, hx | (i ^ 0x3ff00000));
        k += i >> 20;
        double f = x - 1.0;
        double dk = k;
        if ((0x000fffff & (2 + hx)) < 3)
        {
            // |f| < 2^-20
            if (f == 0) return k == 0 ? 0.0 : dk * Ln2Hi + dk * Ln2Lo;
            double rSmall = f * f * (0.5 - 0.33333333333333333 * f);
            return k == 0 ? f - rSmall : dk * Ln2Hi - ((rSmall - dk * Ln2Lo) - f);
        }
        double s = f / (2.0 + f);
        double z = s * s, w = z * z;
        int near = (hx - 0x6147a) | (0x6b851 - hx);
        double t1 = w * (Lg2 + w * (Lg4 + w * Lg6));
        double t2 = z * (Lg1 + w * (Lg3 + w * (Lg5 + w * Lg7)));
        double r = t2 + t1;
        if (near > 0)
        {
            double hfsq = 0.5 * f * f;
            return k == 0 ? f - (hfsq - s * (hfsq + r)) : dk * Ln2Hi - ((hfsq - (s * (hfsq + r) + dk * Ln2Lo)) - f);
        }
        return k == 0 ? f - s * (f - r) : dk * Ln2Hi - ((s * (f - r) - dk * Ln2Lo) - f);
    }

    /// <summary>Common logarithm log10 x, as ln x / ln 10.</summary>
    public static double Log10(double x) => Log(x) / Ln10;

    /// <summary>10^x, as e^(x ln 10).</summary>
    public static double Exp10(double x) => Exp(x * Ln10);

    /// <summary>e^x - 1, accurate relative to the result also for x near zero.</summary>
    public static double ExpM1(double x)
    {
        double u = Exp(x);
        if (u == 1.0) return x;
        double um1 = u - 1.0;
        if (um1 == -1.0) return -1.0;
        if (double.IsPositiveInfinity(u)) return u;
        return um1 * x / Log(u);
    }

    /// <summary>Hyperbolic cosine.</summary>
    public static double Cosh(double x)
    {
        double t = Exp(Math.Abs(x));
        return 0.5 * t + 0.5 / t;
    }

    /// <summary>arctan x [rad], within a few units in the last place, from IEEE arithmetic alone.</summary>
    /// <remarks>Argument reduction by arctan x = pi/2 - arctan(1/x) for x &gt; 1 and arctan x = pi/6 +
    /// arctan((sqrt(3) x - 1)/(x + sqrt(3))) for x &gt; 2 - sqrt(3), then the Maclaurin series, whose terms
    /// fall by x^2 &lt; 0.072 each (e.g. Abramowitz and Stegun 1964, eqs. 4.4.42 and 4.4.34).</remarks>
    public static double Atan(double x)
    {
        if (double.IsNaN(x)) return x;
        if (x < 0) return -Atan(-x);
        if (double.IsPositiveInfinity(x)) return Math.PI / 2;
        if (x > 1) return Math.PI / 2 - Atan(1 / x);
        const double sqrt3 = 1.7320508075688772, tanPiOver12 = 0.2679491924311227;
        double offset = 0;
        if (x > tanPiOver12)
        {
            x = (sqrt3 * x - 1) / (x + sqrt3);
            offset = Math.PI / 6;
        }
        double x2 = x * x, power = x, sum = 0;
        for (int k = 0; k < 40; k++)
        {
            double term = power / (2 * k + 1);
            double next = (k & 1) == 0 ? sum + term : sum - term;
            if (next == sum) break;
            sum = next;
            power *= x2;
        }
        return offset + sum;
    }

    /// <summary>sin x for |x| up to 2^20 pi/2 (1.6e6 rad); beyond that the platform's function.</summary>
    public static double Sin(double x)
    {
        int hx = HighWord(x) & 0x7fffffff;
        if (hx <= 0x3fe921fb) return KernelSin(x, 0.0, false); // |x| <= pi/4
        if (hx >= 0x413921fb) return Math.Sin(x);
        int n = ReduceByHalfPi(x, out double y0, out double y1);
        return SinOfQuadrant(n, y0, y1);
    }

    /// <summary>cos x for |x| up to 2^20 pi/2 (1.6e6 rad); beyond that the platform's function.</summary>
    public static double Cos(double x)
    {
        int hx = HighWord(x) & 0x7fffffff;
        if (hx <= 0x3fe921fb) return KernelCos(x, 0.0); // |x| <= pi/4
        if (hx >= 0x413921fb) return Math.Cos(x);
        int n = ReduceByHalfPi(x, out double y0, out double y1);
        return SinOfQuadrant(n + 1, y0, y1); // cos x = sin(x + pi/2)
    }

    /// <summary>sin(n pi/2 + y0 + y1) for |y0 + y1| &lt;= pi/4.</summary>
    private static double SinOfQuadrant(int n, double y0, double y1) => (n & 3) switch
    {
        0 => KernelSin(y0, y1, true),
        1 => KernelCos(y0, y1),
        2 => -KernelSin(y0, y1, true),
        _ => -KernelCos(y0, y1),
    };

    /// <summary>
    /// x = n pi/2 + (y0 + y1) with |y0 + y1| &lt;= pi/4, by Cody and Waite's reduction with pi/2 in up to three
    /// parts, each further part taken only when cancellation asks for it (fdlibm e_rem_pio2.c, medium range).
    /// </summary>
    private static int ReduceByHalfPi(double x, out double y0, out double y1)
    {
        const double InvPio2 = 6.36619772367581382433e-01;
        const double Pio2a = 1.57079632673412561417e+00, Pio2aTail = 6.07710050650619224932e-11;
        const double Pio2b = 6.07710050630396597660e-11, Pio2bTail = 2.02226624879595063154e-21;
        const double Pio2c = 2.02226624871116645580e-21, Pio2cTail = 8.47842766036889956997e-32;
        double t = Math.Abs(x);
        int n = (int)(t * InvPio2 + 0.5);
        double fn = n;
        double r = t - fn * Pio2a;
        double w = fn * Pio2aTail;
        int exponent = (HighWord(t) >> 20) & 0x7ff;
        y0 = r - w;
        if (exponent - ((HighWord(y0) >> 20) & 0x7ff) > 16)
        {
            double u = r;
            w = fn * Pio2b;
            r = u - w;
            w = fn * Pio2bTail - ((u - r) - w);
            y0 = r - w;
            if (exponent - ((HighWord(y0) >> 20) & 0x7ff) > 49)
            {
                u = r;
                w = fn * Pio2c;
                r = u - w;
                w = fn * Pio2cTail - ((u - r) - w);
                y0 = r - w;
            }
        }
        y1 = (r - y0) - w;
        if (x < 0)
        {
            y0 = -y0;
            y1 = -y1;
            return -n;
        }
        return n;
    }

    /// <summary>sin(x + y) on [-pi/4, pi/4], y the tail of x (fdlibm k_sin.c).</summary>
    private static double KernelSin(double x, double y, bool hasTail)
    {
        const double S1 = -1.66666666666666324348e-01, S2 = 8.33333333332248946124e-03, S3 = -1.98412698298579493134e-04;
        const double S4 = 2.75573137070700676789e-06, S5 = -2.50507602534068634195e-08, S6 = 1.58969099521155010221e-10;
        if ((HighWord(x) & 0x7fffffff) < 0x3e400000) return x; // |x| < 2^-27
        double z = x * x, v = z * x;
        double r = S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)));
        if (!hasTail) return x + v * (S1 + z * r);
        return x - ((z * (0.5 * y - v * r) - y) - v * S1);
    }

    /// <summary>cos(x + y) on [-pi/4, pi/4], y the tail of x (fdlibm k_cos.c).</summary>
    private static double KernelCos(double x, double y)
    {
        const double C1 = 4.16666666666666019037e-02, C2 = -1.38888888888741095749e-03, C3 = 2.48015872894767294178e-05;
        const double C4 = -2.75573143513906633035e-07, C5 = 2.08757232129817482790e-09, C6 = -1.13596475577881948265e-11;
        int ix = HighWord(x) & 0x7fffffff;
        if (ix < 0x3e400000) return 1.0; // |x| < 2^-27
        double z = x * x;
        double r = z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        if (ix < 0x3FD33333) return 1.0 - (0.5 * z - (z * r - x * y)); // |x| < 0.3
        // 1 - x^2/2 split as (1 - q) - (x^2/2 - q) with q exact, so the subtraction loses nothing.
        double q = ix > 0x3fe90000 ? 0.28125 : BitConverter.Int64BitsToDouble((long)(ix - 0x00200000) << 32);
        double hz = 0.5 * z - q;
        double a = 1.0 - q;
        return a - (hz - (z * r - x * y));
    }

    private static int HighWord(double x) => (int)(BitConverter.DoubleToInt64Bits(x) >> 32);

    private static double WithHighWord(double x, int high) =>
        BitConverter.Int64BitsToDouble((BitConverter.DoubleToInt64Bits(x) & 0xffffffffL) | ((long)high << 32));
}
