using MpptArena.Arrays;
using ScottPlot;

namespace MpptArena.Reports.Plots;

/// <summary>I-V and P-V plots of one array state, with every local maximum and the global one marked.</summary>
public static class CurvePlots
{
    /// <summary>The I-V curve with the maxima marked.</summary>
    public static Plot CurrentVoltage(string title, double[] voltageV, double[] currentA, PowerPeaks peaks) =>
        Curve(voltageV, currentA, peaks, p => p.CurrentA, "I-V", Colors.Navy, $"I-V curve, {title}", "array current [A]",
            currentA.Max() * 1.1, Alignment.LowerLeft);

    /// <summary>The P-V curve with the maxima marked.</summary>
    public static Plot PowerVoltage(string title, double[] voltageV, double[] currentA, PowerPeaks peaks) =>
        Curve(voltageV, voltageV.Zip(currentA, (v, i) => v * i).ToArray(), peaks, p => p.PowerW, "P-V", Colors.DarkGreen,
            $"P-V curve, {title}", "array power [W]", peaks.Global.PowerW * 1.15, Alignment.UpperLeft);

    private static Plot Curve(double[] voltageV, double[] y, PowerPeaks peaks, Func<PowerPeak, double> peakY, string name,
        Color color, string title, string yLabel, double yMax, Alignment legend)
    {
        var plot = new Plot();
        var line = plot.Add.ScatterLine(voltageV, y);
        line.LegendText = $"{name} curve";
        line.LineWidth = 2;
        line.Color = color;
        MarkPeaks(plot, peaks, peakY);
        plot.Title(title);
        plot.XLabel("array voltage [V]");
        plot.YLabel(yLabel);
        plot.Axes.SetLimitsY(0, yMax);
        plot.ShowLegend(legend);
        return plot;
    }

    private static void MarkPeaks(Plot plot, PowerPeaks peaks, Func<PowerPeak, double> y)
    {
        bool labelled = false;
        for (int k = 0; k < peaks.Peaks.Count; k++)
        {
            if (k == peaks.GlobalIndex) continue;
            var m = plot.Add.Marker(peaks.Peaks[k].VoltageV, y(peaks.Peaks[k]), MarkerShape.OpenCircle, 16, Colors.DarkOrange);
            if (!labelled) { m.LegendText = "local MPP"; labelled = true; }
        }
        var g = peaks.Global;
        var gm = plot.Add.Marker(g.VoltageV, y(g), MarkerShape.FilledDiamond, 18, Colors.Red);
        gm.LegendText = $"global MPP {g.PowerW:0.#} W at {g.VoltageV:0.#} V";
    }
}
