namespace MpptArena.Numerics;

/// <summary>Golden-section search for the maximum of a unimodal function on an interval.</summary>
/// <remarks>J. Kiefer, "Sequential minimax search for a maximum", Proc. AMS 4 (1953) 502-506.</remarks>
public static class GoldenSection
{
    private static readonly double InvPhi = (Math.Sqrt(5.0) - 1.0) / 2.0;

    /// <summary>Abscissa of the maximum of <paramref name="f"/> on [lo, hi].</summary>
    /// <param name="f">Function to maximise.</param>
    /// <param name="lo">Lower end of the interval.</param>
    /// <param name="hi">Upper end of the interval.</param>
    /// <param name="tolerance">Width of the final bracket, in the abscissa's unit.</param>
    public static double Maximise(Func<double, double> f, double lo, double hi, double tolerance)
    {
        double a = lo, b = hi;
        double c = b - InvPhi * (b - a), d = a + InvPhi * (b - a);
        double fc = f(c), fd = f(d);
        for (int i = 0; i < 200 && b - a > tolerance; i++)
        {
            if (fc >= fd)
            {
                b = d; d = c; fd = fc;
                c = b - InvPhi * (b - a); fc = f(c);
            }
            else
            {
                a = c; c = d; fc = fd;
                d = a + InvPhi * (b - a); fd = f(d);
            }
        }
        return fc >= fd ? c : d;
    }
}
