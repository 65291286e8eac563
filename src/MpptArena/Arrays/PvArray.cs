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
        // The bypass diode sits in the module's junction box: taken at the cells' temperature (common practice).
        return new SubstringModel(cells, Layout.Bypass.SaturationCurrentAt(cellTemperatureC), Layout.Bypass.IdealityVoltageV(cellTemperatureC));
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
        var stringMakeUps = new List<StringMakeUp>();
        var stringCounts = new List<int>();
        int perString = Layout.SubstringsPerString;
        var keys = new (double G, double T)[perString];
        for (int s = 0; s < Layout.StringsInParallel; s++)
        {
            // Identical substrings (same irradiance and temperature) are solved once per string, in ascending
            // order of (irradiance, temperature); identical strings once per array.
            for (int k = 0; k < perString; k++)
            {
                int index = s * perString + k;
                keys[k] = (conditions.IrradianceWm2[index], conditions.CellTemperatureC[index]);
            }
            SortAscending(keys);
            int distinctCount = 1;
            for (int k = 1; k < perString; k++) if (keys[k] != keys[k - 1]) distinctCount++;
            var distinctKeys = new (double G, double T)[distinctCount];
            var counts = new int[distinctCount];
            for (int k = 0, d = -1; k < perString; k++)
            {
                if (k == 0 || keys[k] != keys[k - 1]) distinctKeys[++d] = keys[k];
                counts[d]++;
            }
            var makeUp = new StringMakeUp(distinctKeys, counts);
            int existing = stringMakeUps.FindIndex(makeUp.SameAs);
            if (existing >= 0)
            {
                stringCounts[existing]++;
                continue;
            }
            var distinct = new SubstringModel[distinctCount];
            double weightedT = 0;
            for (int d = 0; d < distinctCount; d++)
            {
                distinct[d] = Substring(distinctKeys[d].G, distinctKeys[d].T);
                weightedT += distinctKeys[d].T * counts[d];
            }
            var blocking = Layout.Blocking;
            double meanT = weightedT / perString;
            strings.Add(blocking is null
                ? new StringModel(distinct, counts)
                : new StringModel(distinct, counts, blocking.SaturationCurrentAt(meanT), blocking.IdealityVoltageV(meanT)));
            stringMakeUps.Add(makeUp);
            stringCounts.Add(1);
        }
        return new ExactArrayCurve(strings.ToArray(), stringCounts.ToArray());
    }

    /// <summary>A string's distinct substring conditions in ascending order and how many substrings share each.</summary>
    private sealed record StringMakeUp((double G, double T)[] Conditions, int[] Counts)
    {
        public bool SameAs(StringMakeUp other) => Conditions.AsSpan().SequenceEqual(other.Conditions) && Counts.AsSpan().SequenceEqual(other.Counts);
    }

    /// <summary>Insertion sort by irradiance, then temperature (a string's few distinct values mostly come in runs, so this is close to linear).</summary>
    private static void SortAscending((double G, double T)[] keys)
    {
        for (int k = 1; k < keys.Length; k++)
        {
            var key = keys[k];
            int j = k - 1;
            while (j >= 0 && Compare(keys[j], key) > 0)
            {
                keys[j + 1] = keys[j];
                j--;
            }
            keys[j + 1] = key;
        }
    }

    private static int Compare((double G, double T) a, (double G, double T) b)
    {
        int byIrradiance = a.G.CompareTo(b.G);
        return byIrradiance != 0 ? byIrradiance : a.T.CompareTo(b.T);
    }
}
