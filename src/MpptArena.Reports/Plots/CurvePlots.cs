using MpptArena.Arrays;
using ScottPlot;

namespace MpptArena.Reports.Plots;

/// <summary>I-V and P-V plots of one array state, with every local maximum and the global one marked.</summary>
public static class CurvePlots
{
    /// <summary>The I-V curve with the maxima marked.</summary>
    public static Plot CurrentVoltage(string title, double[] voltageV, double[] currentA, PowerPeaks peaks)
    {
        var plot = new Plot();
        var line = plot.Add.ScatterLine(voltageV, currentA);
        line.LegendText = "I-V curve";
        line.LineWidth = 2;
        line.Color = Colors.Navy;
        MarkPeaks(plot, peaks, p => p.CurrentA);
        plot.Title($"I-V curve, {title}");
        plot.XLabel("array voltage [V]");
        plot.YLabel("array current [A]");
        plot.Axes.SetLimitsY(0, currentA.Max() * 1.1);
        plot.ShowLegend(Alignment.LowerLeft);
        return plot;
    }

    /// <summary>The P-V curve with the maxima marked.</summary>
    public static Plot PowerVoltage(string title, double[] voltageV, double[] currentA, PowerPeaks peaks)
    {
        var plot = new Plot();
        var line = plot.Add.ScatterLine(voltageV, voltageV.Zip(currentA, (v, i) => v * i).ToArray());
        line.LegendText = "P-V curve";
        line.LineWidth = 2;
        line.Color = Colors.DarkGreen;
        MarkPeaks(plot, peaks, p => p.PowerW);
        plot.Title($"P-V curve, {title}");
        plot.XLabel("array voltage [V]");
        plot.YLabel("array power [W]");
        plot.Axes.SetLimitsY(0, peaks.Global.PowerW * 1.15);
        plot.ShowLegend(Alignment.UpperLeft);
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
