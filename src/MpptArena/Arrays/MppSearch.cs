using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// Finds every local maximum of P(V) = V I(V) on [0, Voc] and the global one: a dense scan brackets
/// each maximum between neighbouring samples, then golden-section search refines each bracket.
/// </summary>
/// <remarks>
/// Under partial shading a string shows up to one maximum per distinct substring irradiance level
/// (H. Patel, V. Agarwal, IEEE Trans. Industrial Electronics 55(4), 2008); each hill spans at least
/// about one substring's voltage, so a scan with many samples per substring cannot step over one.
/// </remarks>
public static class MppSearch
{
    /// <summary>Local and global maxima of the array's power curve.</summary>
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
