using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// Finds every local maximum of P(V) = V I(V) on [0, Voc] and the global one. On a prepared curve every
/// critical point is found exactly (<see cref="PreparedArrayCurve.PowerCriticalPoints"/>: none can be
/// stepped over), and maxima less prominent than <see cref="MinProminenceShare"/> of the global maximum are
/// merged into their neighbours; <see cref="RefineOnExact"/> then moves each maximum onto the exact solve.
/// A generic curve is scanned densely instead.
/// </summary>
/// <remarks>
/// Under partial shading a string shows up to one maximum per distinct substring irradiance level
/// (H. Patel, V. Agarwal, IEEE Trans. Industrial Electronics 55(4), 2008); with parallel strings hills can
/// be 1-2 V wide. Prominence is the 1-D topographic one: a maximum's height above the higher of the lowest
/// points that separate it from higher ground on either side; merging the least prominent first is the
/// persistence simplification of H. Edelsbrunner, D. Letscher, A. Zomorodian, "Topological persistence
/// and simplification", Discrete Comput. Geom. 28 (2002) 511-533.
/// </remarks>
public static class MppSearch
{
    /// <summary>Maxima whose prominence is below this share of the global maximum's power are not reported [-].</summary>
    public const double MinProminenceShare = 1e-4;

    /// <summary>Every local maximum of the prepared curve's power with a prominence of at least <paramref name="minProminenceShare"/> of the global one.</summary>
    /// <param name="curve">Prepared array characteristic.</param>
    /// <param name="minProminenceShare">Smallest prominence kept, as a share of the global maximum's power [-].</param>
    public static PowerPeaks FindPeaks(PreparedArrayCurve curve, double minProminenceShare = MinProminenceShare)
    {
        double voc = curve.OpenCircuitVoltageV;
        if (!(voc > 0)) return PowerPeaks.None;
        // Alternating sequence valley, peak, valley, ..., peak, valley: the ends (0 V and Voc) deliver no power.
        var points = new List<(double V, double P, bool IsMaximum)> { (0.0, 0.0, false) };
        foreach (var (v, isMax) in curve.PowerCriticalPoints(0.0, voc))
        {
            if (points[^1].IsMaximum == isMax) continue; // a sign change lost to rounding at a node: keep the alternation
            points.Add((v, v * curve.CurrentAtVoltage(v), isMax));
        }
        if (points[^1].IsMaximum) points.Add((voc, 0.0, false));
        if (points.Count < 3) return PowerPeaks.None;
        double pMax = points.Where(p => p.IsMaximum).Max(p => p.P);
        if (!(pMax > 0)) return PowerPeaks.None;
        Simplify(points, minProminenceShare * pMax);
        var peaks = new List<PowerPeak>();
        var valleys = new List<double>();
        for (int k = 1; k < points.Count - 1; k++)
        {
            var (v, p, isMax) = points[k];
            if (isMax) peaks.Add(new PowerPeak(v, p / v, p));
            else valleys.Add(v);
        }
        int global = 0;
        for (int k = 1; k < peaks.Count; k++) if (peaks[k].PowerW > peaks[global].PowerW) global = k;
        return new PowerPeaks(peaks, global, valleys);
    }

    /// <summary>
    /// Removes, least prominent first, every maximum whose height above the higher of its two neighbouring
    /// minima is below <paramref name="minProminenceW"/>, merging those minima into the lower one; the global
    /// maximum always stays. <paramref name="points"/> alternates minimum, maximum, ..., minimum.
    /// </summary>
    private static void Simplify(List<(double V, double P, bool IsMaximum)> points, double minProminenceW)
    {
        while (points.Count > 3)
        {
            int weakest = -1;
            double weakestHeight = minProminenceW;
            for (int k = 1; k < points.Count - 1; k += 2)
            {
                double height = points[k].P - Math.Max(points[k - 1].P, points[k + 1].P);
                if (height < weakestHeight)
                {
                    weakest = k;
                    weakestHeight = height;
                }
            }
            if (weakest < 0) return;
            int lower = points[weakest - 1].P <= points[weakest + 1].P ? weakest - 1 : weakest + 1;
            var keep = points[lower];
            points.RemoveRange(weakest - 1, 3);
            points.Insert(weakest - 1, keep);
        }
    }

    /// <summary>
    /// The maxima of <paramref name="prepared"/> moved onto the exact solve: each is the root of dP/dV =
    /// I + V dI/dV of the exact curve (closed-form slope), found by Brent's method in a bracket grown from
    /// 50 mV around the prepared maximum until the slope changes sign (never past halfway to a neighbouring
    /// valley), or by golden-section search on its hill when no bracket shows. Peaks are refined in parallel;
    /// each refinement is independent, so the result does not depend on the thread count. The valleys stay
    /// those of the prepared curve (they bound hills; nothing reads their power).
    /// </summary>
    /// <remarks>R. P. Brent, Algorithms for Minimization without Derivatives, Prentice-Hall 1973, ch. 4
    /// (MathNet.Numerics' implementation).</remarks>
    public static PowerPeaks RefineOnExact(PowerPeaks prepared, ExactArrayCurve exact)
    {
        if (prepared.Peaks.Count == 0 || prepared.Global.PowerW <= 0) return prepared;
        double voc = exact.OpenCircuitVoltageV;
        double Slope(double v)
        {
            double i = exact.CurrentAtVoltage(v, out double di);
            return i + v * di;
        }
        double Refine(double lowV, double atV, double highV, bool maximum)
        {
            double sign = maximum ? 1 : -1;
            double limitLo = 0.5 * (lowV + atV), limitHi = 0.5 * (atV + highV);
            for (double delta = 0.05; ; delta *= 4)
            {
                double a = Math.Max(atV - delta, limitLo), b = Math.Min(atV + delta, limitHi);
                double sa = sign * Slope(a), sb = sign * Slope(b);
                if (sa > 0 && sb < 0)
                {
                    // An accuracy of 1e-13 A on dP/dV places the root to about 1e-13 V (|d2P/dV2| is of order 1 A/V or more).
                    return MathNet.Numerics.RootFinding.Brent.TryFindRoot(Slope, a, b, 1e-13, 200, out double root) ? root : Bisection.FindSignChange(v => sign * Slope(v) > 0, a, b);
                }
                if (a <= limitLo && b >= limitHi) break;
            }
            return GoldenSection.Maximise(v => sign * v * exact.CurrentAtVoltage(v), lowV, highV, voc * 1e-12);
        }
        var voltages = new double[prepared.Peaks.Count];
        Parallel.For(0, voltages.Length, k =>
        {
            double low = k == 0 ? 0.0 : prepared.ValleysV[k - 1], high = k == voltages.Length - 1 ? voc : prepared.ValleysV[k];
            voltages[k] = Refine(low, prepared.Peaks[k].VoltageV, high, maximum: true);
        });
        var peaks = voltages.Select(v => { double i = exact.CurrentAtVoltage(v); return new PowerPeak(v, i, v * i); }).ToList();
        int global = 0;
        for (int k = 1; k < peaks.Count; k++) if (peaks[k].PowerW > peaks[global].PowerW) global = k;
        return new PowerPeaks(peaks, global, prepared.ValleysV);
    }

    /// <summary>Local and global maxima of any array curve by a dense scan (each maximum bracketed between neighbouring samples, then golden-section search).</summary>
    /// <param name="curve">Array characteristic.</param>
    /// <param name="samples">Scan points on [0, Voc] [-]; default 2000.</param>
    /// <param name="relativeTolerance">Width of the final voltage bracket relative to Voc [-].</param>
    public static PowerPeaks FindPeaks(IArrayCurve curve, int samples = 2000, double relativeTolerance = 1e-10)
    {
        double voc = curve.OpenCircuitVoltageV;
        if (!(voc > 0)) return PowerPeaks.None;
        var p = new double[samples + 1];
        for (int i = 0; i <= samples; i++)
        {
            double v = voc * i / samples;
            p[i] = v * curve.CurrentAtVoltage(v);
        }
        double pMax = p.Max();
        if (!(pMax > 0)) return PowerPeaks.None;

        var peaks = new List<PowerPeak>();
        for (int i = 1; i < samples; i++)
        {
            // A strict rise then a non-rise marks one hill; plateaus collapse to their first sample.
            if (p[i] > p[i - 1] && p[i] >= p[i + 1])
            {
                double lo = voc * (i - 1) / samples, hi = voc * (i + 1) / samples;
                double v = GoldenSection.Maximise(x => x * curve.CurrentAtVoltage(x), lo, hi, voc * relativeTolerance);
                double c = curve.CurrentAtVoltage(v);
                peaks.Add(new PowerPeak(v, c, v * c));
            }
        }
        if (peaks.Count == 0)
        {
            int best = Array.IndexOf(p, pMax);
            double v = voc * best / samples;
            peaks.Add(new PowerPeak(v, curve.CurrentAtVoltage(v), pMax));
        }
        int global = 0;
        for (int k = 1; k < peaks.Count; k++) if (peaks[k].PowerW > peaks[global].PowerW) global = k;
        var valleys = new List<double>(peaks.Count);
        for (int k = 0; k + 1 < peaks.Count; k++)
        {
            double lo = peaks[k].VoltageV, hi = peaks[k + 1].VoltageV;
            valleys.Add(GoldenSection.Maximise(x => -x * curve.CurrentAtVoltage(x), lo, hi, voc * 1e-6));
        }
        return new PowerPeaks(peaks, global, valleys);
    }
}
