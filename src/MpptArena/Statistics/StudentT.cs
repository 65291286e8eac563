using MpptArena.Numerics;

namespace MpptArena.Statistics;

/// <summary>
/// Student's t distribution for whole degrees of freedom, with the same bits on every machine (only IEEE
/// arithmetic and square roots: no platform maths library).
/// </summary>
/// <remarks>
/// The two-sided probability A(t | nu) = P(|T| &lt;= t) in closed form, M. Abramowitz and I. A. Stegun,
/// Handbook of Mathematical Functions, 1964, eqs. 26.7.3 (nu odd) and 26.7.4 (nu even), with
/// theta = arctan(t / sqrt(nu)); the quantile by bisection on it, which is monotone in t.
/// </remarks>
public static class StudentT
{
    /// <summary>A(t | nu) = P(|T| &lt;= t) [-] for t &gt;= 0.</summary>
    /// <param name="t">Bound [-], at least 0.</param>
    /// <param name="degreesOfFreedom">nu, at least 1.</param>
    public static double TwoSidedProbability(double t, int degreesOfFreedom)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(degreesOfFreedom, 1);
        if (t <= 0) return 0;
        if (double.IsPositiveInfinity(t)) return 1;
        double nu = degreesOfFreedom;
        double r = Math.Sqrt(nu + t * t);
        double sin = t / r, cos = Math.Sqrt(nu) / r, cos2 = cos * cos;
        if (degreesOfFreedom % 2 == 0)
        {
            // 26.7.4: sin(theta) [1 + (1/2) cos^2 + (1 3)/(2 4) cos^4 + ... + (1 3 ... (nu - 3))/(2 4 ... (nu - 2)) cos^(nu - 2)]
            double term = 1, sum = 1;
            for (int k = 2; k <= degreesOfFreedom - 2; k += 2)
            {
                term *= (k - 1.0) / k * cos2;
                sum += term;
            }
            return Math.Min(1.0, sin * sum);
        }
        // 26.7.3: (2/pi) {theta + sin(theta) [cos + (2/3) cos^3 + ... + (2 4 ... (nu - 3))/(1 3 ... (nu - 2)) cos^(nu - 2)]}
        double theta = PortableMath.Atan(t / Math.Sqrt(nu));
        double series = 0;
        if (degreesOfFreedom > 1)
        {
            double c = cos;
            series = c;
            for (int k = 3; k <= degreesOfFreedom - 2; k += 2)
            {
                c *= (k - 1.0) / k * cos2;
                series += c;
            }
        }
        return Math.Min(1.0, 2.0 / Math.PI * (theta + sin * series));
    }

    /// <summary>The t with P(|T| &lt;= t) = <paramref name="coverage"/>: the multiplier of a two-sided confidence interval.</summary>
    /// <param name="coverage">Two-sided coverage [-], in (0, 1), e.g. 0.95.</param>
    /// <param name="degreesOfFreedom">nu, at least 1.</param>
    public static double TwoSidedQuantile(double coverage, int degreesOfFreedom)
    {
        if (!(coverage > 0 && coverage < 1)) throw new ArgumentOutOfRangeException(nameof(coverage), coverage, "coverage must lie in (0, 1)");
        double hi = 1;
        while (TwoSidedProbability(hi, degreesOfFreedom) < coverage) hi *= 2;
        return Bisection.FindSignChange(t => TwoSidedProbability(t, degreesOfFreedom) < coverage, 0, hi);
    }
}
