using MpptArena.Arrays;

namespace MpptArena.Benchmarks.Reference;

/// <summary>
/// The straightforward implementation of the same array model, kept as the yardstick: every substring
/// voltage by bisection on the implicit single-diode equation with its bypass diode (no closed form),
/// every string current by bisection on the series voltage sum. Same equations as the library, none of
/// its speed-ups (Lambert W, Newton, tables, sharing of identical substrings).
/// </summary>
public sealed class ReferenceArray(PvArray array, ArrayConditions conditions)
{
    private readonly SubstringModel[] _substrings = Enumerable.Range(0, array.Layout.SubstringCount)
        .Select(k => array.Substring(conditions.IrradianceWm2[k], conditions.CellTemperatureC[k])).ToArray();

    /// <summary>Cell current at a cell-group voltage by bisection on I = IL - I0 (exp((V + I Rs)/a) - 1) - (V + I Rs) Gsh.</summary>
    private static double CellCurrent(in SubstringModel s, double v)
    {
        var p = s.Cells;
        double lo = -1e4, hi = p.PhotocurrentA + 1.0;
        for (int i = 0; i < 200; i++)
        {
            double mid = 0.5 * (lo + hi);
            double vd = v + mid * p.SeriesResistanceOhm;
            double f = p.PhotocurrentA - p.SaturationCurrentA * double.ExpM1(System.Math.Min(vd / p.ModifiedIdealityV, 700)) - vd * p.ShuntConductanceS - mid;
            if (f > 0) lo = mid; else hi = mid;
            if (hi - lo < 1e-12) break;
        }
        return 0.5 * (lo + hi);
    }

    private static double SubstringVoltage(in SubstringModel s, double current)
    {
        double lo = -2.0, hi = 2.0 * s.Cells.ModifiedIdealityV * 40;
        for (int i = 0; i < 200; i++)
        {
            double mid = 0.5 * (lo + hi);
            double total = CellCurrent(s, mid) + s.BypassCurrent(mid);
            if (total > current) lo = mid; else hi = mid;
            if (hi - lo < 1e-10) break;
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>Array current [A] at voltage [V].</summary>
    public double CurrentAtVoltage(double voltageV)
    {
        double sum = 0;
        int perString = array.Layout.SubstringsPerString;
        for (int s = 0; s < array.Layout.StringsInParallel; s++)
        {
            double lo = -100, hi = 30;
            for (int i = 0; i < 100; i++)
            {
                double mid = 0.5 * (lo + hi), v = 0;
                for (int k = 0; k < perString; k++) v += SubstringVoltage(_substrings[s * perString + k], mid);
                if (v > voltageV) lo = mid; else hi = mid;
                if (hi - lo < 1e-9) break;
            }
            sum += 0.5 * (lo + hi);
        }
        return sum;
    }
}
