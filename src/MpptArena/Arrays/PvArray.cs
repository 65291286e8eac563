using MpptArena.Pv;

namespace MpptArena.Arrays;

/// <summary>A PV array: one module type in a layout. Solves its characteristic for given conditions.</summary>
/// <param name="Module">Module model at reference conditions.</param>
/// <param name="Layout">Array layout.</param>
public sealed record PvArray(ModuleModel Module, ArrayLayout Layout)
{
    /// <summary>Cells in one substring [-].</summary>
    public int CellsPerSubstring => Module.CellsInSeries / Layout.SubstringsPerModule;

    /// <summary>Conditions for this array, uniform.</summary>
    /// <param name="irradianceWm2">Irradiance [W/m2].</param>
    /// <param name="cellTemperatureC">Cell temperature [degC].</param>
    public ArrayConditions UniformConditions(double irradianceWm2, double cellTemperatureC) =>
        new(Layout.SubstringCount, irradianceWm2, cellTemperatureC);

    /// <summary>Single substring model at one condition.</summary>
    /// <param name="irradianceWm2">Irradiance [W/m2].</param>
    /// <param name="cellTemperatureC">Cell temperature [degC].</param>
    public SubstringModel Substring(double irradianceWm2, double cellTemperatureC)
    {
        var cells = Module.At(irradianceWm2, cellTemperatureC).ScaledToCellFraction(1.0 / Layout.SubstringsPerModule);
        return new SubstringModel(cells, Layout.Bypass.SaturationCurrentA, Layout.Bypass.IdealityVoltageV(cellTemperatureC));
    }

    /// <summary>The exact characteristic of the array under <paramref name="conditions"/>.</summary>
    /// <param name="conditions">Per-substring irradiance and temperature.</param>
    public ExactArrayCurve Solve(ArrayConditions conditions)
    {
        if (conditions.IrradianceWm2.Length != Layout.SubstringCount)
        {
            throw new ArgumentException($"conditions hold {conditions.IrradianceWm2.Length} substrings, the layout has {Layout.SubstringCount}");
        }
        var strings = new List<StringModel>();
        var stringKeys = new List<string>();
        var stringCounts = new List<int>();
        int perString = Layout.SubstringsPerString;
        for (int s = 0; s < Layout.StringsInParallel; s++)
        {
            // Identical substrings (same irradiance and temperature) are solved once per string.
            var groups = new SortedDictionary<(double G, double T), int>();
            for (int k = 0; k < perString; k++)
            {
                int index = s * perString + k;
                var key = (conditions.IrradianceWm2[index], conditions.CellTemperatureC[index]);
                groups[key] = groups.TryGetValue(key, out int c) ? c + 1 : 1;
            }
            string signature = string.Join(";", groups.Select(g => $"{g.Key.G:R},{g.Key.T:R},{g.Value}"));
            int existing = stringKeys.IndexOf(signature);
            if (existing >= 0)
            {
                stringCounts[existing]++;
                continue;
            }
            var distinct = groups.Keys.Select(k => Substring(k.G, k.T)).ToArray();
            var counts = groups.Values.ToArray();
            var blocking = Layout.Blocking;
            double meanT = groups.Sum(g => g.Key.T * g.Value) / perString;
            strings.Add(blocking is null
                ? new StringModel(distinct, counts)
                : new StringModel(distinct, counts, blocking.SaturationCurrentA, blocking.IdealityVoltageV(meanT)));
            stringKeys.Add(signature);
            stringCounts.Add(1);
        }
        return new ExactArrayCurve(strings.ToArray(), stringCounts.ToArray());
    }
}
