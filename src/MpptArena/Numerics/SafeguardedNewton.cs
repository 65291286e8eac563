namespace MpptArena.Numerics;

/// <summary>
/// Newton's method kept inside a bracket that always holds the root, falling back to bisection when a
/// Newton step would leave the bracket or would not halve it fast enough. Always converges for a
/// continuous function with a sign change; quadratically near a simple root.
/// </summary>
/// <remarks>The "rtsafe" safeguard of W. H. Press, S. A. Teukolsky, W. T. Vetterling, B. P. Flannery,
/// Numerical Recipes, 3rd ed., Cambridge University Press 2007, sec. 9.4.</remarks>
public static class SafeguardedNewton
{
    /// <summary>Root of <paramref name="f"/> in [lo, hi] where f(lo) and f(hi) differ in sign.</summary>
    /// <param name="f">Function and slope.</param>
    /// <param name="lo">One end of the bracket.</param>
    /// <param name="hi">Other end of the bracket.</param>
    /// <param name="start">First guess inside the bracket.</param>
    /// <param name="absoluteTolerance">Stop when the step or bracket is below this, in x's unit.</param>
    /// <param name="slopeAtRoot">f'(x) at the returned point.</param>
    public static double FindRoot<TF>(ref TF f, double lo, double hi, double start, double absoluteTolerance, out double slopeAtRoot)
        where TF : struct, IFunctionWithSlope
    {
        double fLo = f.Evaluate(lo, out _);
        // Orient so that f(xl) < 0 < f(xh).
        double xl, xh;
        if (fLo < 0) { xl = lo; xh = hi; } else { xl = hi; xh = lo; }
        double x = start;
        if (!(x > Math.Min(lo, hi) && x < Math.Max(lo, hi))) x = 0.5 * (lo + hi);
        double dxOld = Math.Abs(hi - lo), dx = dxOld;
        double fx = f.Evaluate(x, out double df);
        for (int i = 0; i < 200; i++)
        {
            bool newtonLeaves = ((x - xh) * df - fx) * ((x - xl) * df - fx) > 0;
            bool newtonSlow = Math.Abs(2.0 * fx) > Math.Abs(dxOld * df);
            dxOld = dx;
            if (newtonLeaves || newtonSlow || df == 0)
            {
                dx = 0.5 * (xh - xl);
                x = xl + dx;
            }
            else
            {
                dx = fx / df;
                x -= dx;
            }
            if (Math.Abs(dx) < absoluteTolerance)
            {
                f.Evaluate(x, out slopeAtRoot);
                return x;
            }
            fx = f.Evaluate(x, out df);
            if (fx == 0) break;
            if (fx < 0) xl = x; else xh = x;
        }
        slopeAtRoot = df;
        return x;
    }
}
