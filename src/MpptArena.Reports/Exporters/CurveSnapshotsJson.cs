using System.Text.Json;
using MpptArena.Runs;

namespace MpptArena.Reports.Exporters;

/// <summary>pv-curves.json: the P-V curves kept at the snapshot instants, with their peaks.</summary>
public static class CurveSnapshotsJson
{
    /// <summary>JSON text for the snapshots.</summary>
    public static string Serialize(IReadOnlyList<CurveSnapshot> snapshots)
    {
        var doc = snapshots.Select(s => new
        {
            time_s = s.TimeS,
            global_mpp = new { voltage_v = s.Peaks.Global.VoltageV, power_w = s.Peaks.Global.PowerW },
            peaks = s.Peaks.Peaks.Select(p => new { voltage_v = p.VoltageV, current_a = p.CurrentA, power_w = p.PowerW }),
            voltage_v = s.VoltageV,
            power_w = s.PowerW,
        });
        return JsonSerializer.Serialize(doc, new JsonSerializerOptions { WriteIndented = false }) + "\n";
    }
}
