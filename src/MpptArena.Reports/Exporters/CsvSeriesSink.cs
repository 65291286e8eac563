using System.Globalization;
using MpptArena.Runs;

namespace MpptArena.Reports.Exporters;

/// <summary>
/// Streams a tracker's time series to CSV as the run goes; units in the header. Each row holds interval
/// means (the MPP voltage and the command at the interval's end); the converter columns are empty for
/// the ideal source.
/// </summary>
public sealed class CsvSeriesSink : ISeriesSink
{
    /// <summary>The header line.</summary>
    public const string Header = "time_s,voltage_v,current_a,power_w,mpp_power_w,mpp_voltage_v,command,inductor_current_a,duty,dcm_share";

    private readonly StreamWriter _writer;

    /// <summary>A sink writing to <paramref name="path"/> (created or replaced).</summary>
    public CsvSeriesSink(string path)
    {
        _writer = new StreamWriter(path, false, new System.Text.UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        _writer.WriteLine(Header);
    }

    /// <inheritdoc/>
    public void Write(in SeriesRow r)
    {
        var c = CultureInfo.InvariantCulture;
        _writer.Write(r.TimeS.ToString("0.######", c)); _writer.Write(',');
        _writer.Write(r.VoltageV.ToString("G7", c)); _writer.Write(',');
        _writer.Write(r.CurrentA.ToString("G7", c)); _writer.Write(',');
        _writer.Write(r.PowerW.ToString("G7", c)); _writer.Write(',');
        _writer.Write(r.MppPowerW.ToString("G7", c)); _writer.Write(',');
        _writer.Write(r.MppVoltageV.ToString("G7", c)); _writer.Write(',');
        _writer.Write(r.Command.ToString("G7", c)); _writer.Write(',');
        WriteOptional(r.InductorCurrentA); _writer.Write(',');
        WriteOptional(r.DutyCycle); _writer.Write(',');
        WriteOptional(r.DiscontinuousShare);
        _writer.WriteLine();
    }

    private void WriteOptional(double value)
    {
        if (!double.IsNaN(value)) _writer.Write(value.ToString("G7", CultureInfo.InvariantCulture));
    }

    /// <inheritdoc/>
    public void Dispose() => _writer.Dispose();

    /// <summary>Reads a series file back (for plots).</summary>
    public static List<SeriesRow> Read(string path)
    {
        var rows = new List<SeriesRow>();
        foreach (var line in File.ReadLines(path).Skip(1))
        {
            var f = line.Split(',');
            if (f.Length < 7) continue;
            double P(int k) => k < f.Length && f[k].Length > 0 ? double.Parse(f[k], CultureInfo.InvariantCulture) : double.NaN;
            rows.Add(new SeriesRow(P(0), P(1), P(2), P(3), P(4), P(5), P(6), P(7), P(8), P(9)));
        }
        return rows;
    }
}
