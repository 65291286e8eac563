namespace MpptArena.Numerics;

/// <summary>
/// Bisection on the sign of a function alone, down to neighbouring doubles: the answer does not depend on
/// how small the function is near its root (a current of 1e-11 A is not zero), only on where it changes sign.
/// </summary>
/// <remarks>The bisection method (e.g. W. H. Press et al., Numerical Recipes, 3rd ed., 2007, sec. 9.1): each
/// step halves a bracket that holds a sign change, so at most about 1100 steps reach adjacent doubles
/// from any finite bracket, and about 60 from one whose ends share an exponent.</remarks>
public static class Bisection
{
    /// <summary>
    /// The point of [lo, hi] where <paramref name="isBelowRoot"/> turns from true (at lo) to false (at hi):
    /// the last x found true and the first found false are neighbouring doubles; their midpoint is returned.
    /// </summary>
    /// <param name="isBelowRoot">True for points on the lo side of the root.</param>
    /// <param name="lo">A point on the lo side.</param>
    /// <param name="hi">A point on the hi side.</param>
    public static double FindSignChange(Func<double, bool> isBelowRoot, double lo, double hi)
    {
        for (int k = 0; k < 2200; k++)
        {
            double mid = lo + 0.5 * (hi - lo);
            if (mid <= lo || mid >= hi) break;
            if (isBelowRoot(mid)) lo = mid; else hi = mid;
        }
        return lo + 0.5 * (hi - lo);
    }
}
