using System.Globalization;
using System.Text;
using MpptArena.Arrays;

namespace MpptArena.Reports.Exporters;

/// <summary>The I-V and P-V curve of an array as CSV, with units in the header.</summary>
public static class CurveExport
{
    /// <summary>Samples the curve at <paramref name="points"/> + 1 voltages from 0 to Voc.</summary>
    public static (double[] VoltageV, double[] CurrentA) Sample(IArrayCurve curve, int points = 1000)
    {
        double voc = curve.OpenCircuitVoltageV;
        var v = new double[points + 1];
        var i = new double[points + 1];
        for (int k = 0; k <= points; k++)
        {
            v[k] = voc * k / points;
            i[k] = curve.CurrentAtVoltage(v[k]);
        }
        return (v, i);
    }

    /// <summary>CSV text: voltage_v, current_a, power_w.</summary>
    public static string Csv(double[] voltageV, double[] currentA)
    {
        var c = CultureInfo.InvariantCulture;
        var sb = new StringBuilder("voltage_v,current_a,power_w\n");
        for (int k = 0; k < voltageV.Length; k++)
        {
            sb.Append(voltageV[k].ToString("R", c)).Append(',').Append(currentA[k].ToString("R", c)).Append(',')
              .Append((voltageV[k] * currentA[k]).ToString("R", c)).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>CSV text of the maxima: kind, voltage_v, current_a, power_w.</summary>
    public static string PeaksCsv(PowerPeaks peaks)
    {
        var c = CultureInfo.InvariantCulture;
        var sb = new StringBuilder("peak,is_global,voltage_v,current_a,power_w\n");
        for (int k = 0; k < peaks.Peaks.Count; k++)
        {
            var p = peaks.Peaks[k];
            sb.Append(k + 1).Append(',').Append(k == peaks.GlobalIndex ? "true" : "false").Append(',')
              .Append(p.VoltageV.ToString("R", c)).Append(',').Append(p.CurrentA.ToString("R", c)).Append(',').Append(p.PowerW.ToString("R", c)).Append('\n');
        }
        return sb.ToString();
    }
}
