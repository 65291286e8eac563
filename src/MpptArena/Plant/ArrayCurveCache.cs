using MpptArena.Arrays;

namespace MpptArena.Plant;

/// <summary>
/// Keeps the prepared array curve and its true MPP for the conditions in force. Conditions are held on a
/// grid: each substring's irradiance is rounded to a multiple of twice the irradiance threshold and its
/// temperature to a multiple of twice the temperature threshold, and the curve is replaced only when a
/// rounded value changes. Curves already prepared are kept, keyed by their rounded conditions, so a sky
/// that returns to a state seen before (a ramp back down, a shadow edge moving on) costs a look-up.
/// </summary>
/// <remarks>
/// Error bound of the rule: every substring's irradiance is within dG of the prepared value (half the
/// grid spacing), so its photocurrent is within dG/G_ref IL_ref (De Soto 2006, eq. 3: IL is linear in G)
/// and the array current at any voltage within about n_parallel dG/G_ref Isc_ref; the power error is
/// at most V times that. With dG = 1 W/m2 this is 0.1 % of Isc; the test
/// <c>ReprepareRuleBoundsPowerError</c> checks the bound against the exact solve. The same bound with a
/// threshold measured from the last preparation would re-prepare twice as often on a ramp. A prepared
/// curve depends only on its rounded conditions, so reusing one gives the same numbers as preparing it
/// again: results do not depend on what the store holds.
/// </remarks>
public sealed class ArrayCurveCache
{
    /// <summary>Interpolation nodes kept in the store of prepared curves before it is emptied (about 60 MB with their string curves).</summary>
    public const long MaxStoredNodes = 1_000_000;

    private readonly PvArray _array;
    private readonly double _irradianceGridWm2, _temperatureGridC;
    private readonly ArrayConditions _prepared, _rounded;
    private readonly SubstringTableCache _tables = new();
    private readonly StringCurveCache _strings = new();
    private readonly Dictionary<ConditionsKey, (PreparedArrayCurve Curve, PowerPeaks Peaks)> _store = [];
    private long _storedNodes;
    private bool _hasCurve;

    /// <summary>A cache for <paramref name="array"/> with the given thresholds (the largest distance between true and prepared conditions).</summary>
    /// <param name="array">The array.</param>
    /// <param name="irradianceThresholdWm2">Largest irradiance difference [W/m2] between any substring and its prepared value.</param>
    /// <param name="temperatureThresholdC">Largest temperature difference [K] between any substring and its prepared value.</param>
    public ArrayCurveCache(PvArray array, double irradianceThresholdWm2, double temperatureThresholdC)
    {
        _array = array;
        _irradianceGridWm2 = 2 * irradianceThresholdWm2;
        _temperatureGridC = 2 * temperatureThresholdC;
        _prepared = new ArrayConditions(array.Layout.SubstringCount);
        _rounded = new ArrayConditions(array.Layout.SubstringCount);
    }

    /// <summary>The prepared curve in force.</summary>
    public PreparedArrayCurve Curve { get; private set; } = null!;

    /// <summary>Its local and global maxima.</summary>
    public PowerPeaks Peaks { get; private set; } = PowerPeaks.None;

    /// <summary>Substring tables built and reused so far.</summary>
    public SubstringTableCache Tables => _tables;

    /// <summary>String curves tabulated and reused so far.</summary>
    public StringCurveCache Strings => _strings;

    /// <summary>Curves prepared so far (store misses).</summary>
    public int Preparations { get; private set; }

    /// <summary>Curve changes served from the store of prepared curves (hits).</summary>
    public int Reuses { get; private set; }

    /// <summary>Rounded conditions of the curve in force.</summary>
    public ArrayConditions PreparedConditions => _prepared;

    /// <summary>Replaces the curve if the rounded <paramref name="conditions"/> changed; returns true if it did.</summary>
    public bool Update(ArrayConditions conditions)
    {
        Round(conditions, _rounded);
        if (_hasCurve && Same(_rounded, _prepared)) return false;
        _prepared.CopyFrom(_rounded);
        var key = new ConditionsKey(_prepared);
        if (_store.TryGetValue(key, out var entry))
        {
            Reuses++;
        }
        else
        {
            var curve = new PreparedArrayCurve(_array.Solve(_prepared), _tables, _strings);
            // Every substring alike: no bypass diode conducts between 0 and Voc, the single-diode power curve
            // has one maximum, and a coarse scan brackets it as well as a dense one (common practice).
            int samples = IsUniform(_prepared) ? 64 : Math.Max(400, 25 * _array.Layout.SubstringsPerString);
            entry = (curve, MppSearch.FindPeaks(curve, samples));
            if (_storedNodes + curve.NodeCount > MaxStoredNodes)
            {
                _store.Clear();
                _storedNodes = 0;
            }
            _store[key] = entry;
            _storedNodes += curve.NodeCount;
            Preparations++;
        }
        (Curve, Peaks) = entry;
        _hasCurve = true;
        return true;
    }

    private void Round(ArrayConditions c, ArrayConditions rounded)
    {
        // Neighbouring substrings mostly share their conditions: round each distinct value once.
        double lastG = double.NaN, lastGRounded = 0, lastT = double.NaN, lastTRounded = 0;
        for (int k = 0; k < c.IrradianceWm2.Length; k++)
        {
            double g = c.IrradianceWm2[k], t = c.CellTemperatureC[k];
            if (g != lastG)
            {
                lastG = g;
                lastGRounded = Math.Max(0.0, Math.Round(g / _irradianceGridWm2) * _irradianceGridWm2);
            }
            if (t != lastT)
            {
                lastT = t;
                lastTRounded = Math.Round(t / _temperatureGridC) * _temperatureGridC;
            }
            rounded.IrradianceWm2[k] = lastGRounded;
            rounded.CellTemperatureC[k] = lastTRounded;
        }
    }

    private static bool IsUniform(ArrayConditions c)
    {
        double g = c.IrradianceWm2[0], t = c.CellTemperatureC[0];
        for (int k = 1; k < c.IrradianceWm2.Length; k++)
        {
            if (c.IrradianceWm2[k] != g || c.CellTemperatureC[k] != t) return false;
        }
        return true;
    }

    private static bool Same(ArrayConditions a, ArrayConditions b) =>
        a.IrradianceWm2.AsSpan().SequenceEqual(b.IrradianceWm2) && a.CellTemperatureC.AsSpan().SequenceEqual(b.CellTemperatureC);

    /// <summary>Rounded conditions as a dictionary key (copied, with the hash computed once).</summary>
    private sealed class ConditionsKey : IEquatable<ConditionsKey>
    {
        private readonly double[] _irradianceWm2, _temperatureC;
        private readonly int _hash;

        public ConditionsKey(ArrayConditions c)
        {
            _irradianceWm2 = (double[])c.IrradianceWm2.Clone();
            _temperatureC = (double[])c.CellTemperatureC.Clone();
            var hash = new HashCode();
            foreach (double g in _irradianceWm2) hash.Add(g);
            foreach (double t in _temperatureC) hash.Add(t);
            _hash = hash.ToHashCode();
        }

        public bool Equals(ConditionsKey? other) =>
            other is not null && _hash == other._hash
            && _irradianceWm2.AsSpan().SequenceEqual(other._irradianceWm2) && _temperatureC.AsSpan().SequenceEqual(other._temperatureC);

        public override bool Equals(object? obj) => Equals(obj as ConditionsKey);

        public override int GetHashCode() => _hash;
    }
}
