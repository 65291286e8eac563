using System.Runtime.Intrinsics;
using MpptArena.Arrays;

namespace MpptArena.Plant;

/// <summary>
/// Keeps the prepared array curve and its true MPP for the conditions in force. Conditions that move are
/// held on a grid: each substring's irradiance is rounded to a multiple of twice the irradiance threshold
/// and its temperature to a multiple of twice the temperature threshold, and the curve is replaced only
/// when a rounded value changes. A value that has not changed since the first update (a constant of the
/// scenario, or a substring the shadow never reached) is taken exactly, so a constant 25 degC is
/// simulated at 25 degC, not at the grid's 24.8 degC. A value that moved stays on the grid, also where it
/// comes to rest: taking rests exactly cost the moving-shadow demo 13 % more preparations (56 of 419,
/// 0.74 ms each), and a rest is within the threshold anyway. Curves already prepared are kept, keyed by their rounded conditions, so a sky
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
    private readonly ArrayConditions _prepared, _rounded, _first;
    private readonly bool[] _irradianceMoved, _temperatureMoved;
    private readonly SubstringTableCache _tables = new();
    private readonly StringCurveCache _strings = new();
    private readonly Dictionary<ConditionsKey, (PreparedArrayCurve Curve, PowerPeaks Peaks)> _store = [];
    private readonly ConditionsKey _probe;
    private readonly double[] _fingerprintWeights;
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
        _first = new ArrayConditions(array.Layout.SubstringCount);
        _irradianceMoved = new bool[array.Layout.SubstringCount];
        _temperatureMoved = new bool[array.Layout.SubstringCount];
        _probe = new ConditionsKey(_prepared.IrradianceWm2, _prepared.CellTemperatureC);
        // Fixed, distinct weights (the golden-ratio sequence) so that states differing anywhere hash apart.
        _fingerprintWeights = new double[2 * array.Layout.SubstringCount];
        for (int k = 0; k < _fingerprintWeights.Length; k++) _fingerprintWeights[k] = 1.0 + (k + 1) * 0.6180339887498949 % 1.0;
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
        RoundToGrid(conditions.IrradianceWm2, _rounded.IrradianceWm2, _irradianceGridWm2, 0.0);
        RoundToGrid(conditions.CellTemperatureC, _rounded.CellTemperatureC, _temperatureGridC, double.NegativeInfinity);
        if (!_hasCurve) _first.CopyFrom(conditions);
        bool irradianceSame = KeepUnmovedValues(conditions.IrradianceWm2, _first.IrradianceWm2, _irradianceMoved, _rounded.IrradianceWm2, _prepared.IrradianceWm2);
        bool temperatureSame = KeepUnmovedValues(conditions.CellTemperatureC, _first.CellTemperatureC, _temperatureMoved, _rounded.CellTemperatureC, _prepared.CellTemperatureC);
        if (_hasCurve && irradianceSame && temperatureSame) return false;
        _prepared.CopyFrom(_rounded);
        _probe.Refresh(_fingerprintWeights);
        if (_store.TryGetValue(_probe, out var entry))
        {
            Reuses++;
        }
        else
        {
            var curve = new PreparedArrayCurve(_array.Solve(_prepared), _tables, _strings);
            entry = (curve, MppSearch.FindPeaks(curve));
            if (_storedNodes + curve.NodeCount > MaxStoredNodes)
            {
                _store.Clear();
                _storedNodes = 0;
            }
            _store[_probe.Copy()] = entry;
            _storedNodes += curve.NodeCount;
            Preparations++;
        }
        (Curve, Peaks) = entry;
        _hasCurve = true;
        return true;
    }

    /// <summary>
    /// Rounds every value to the nearest multiple of <paramref name="grid"/> (ties to even, no lower than
    /// <paramref name="floor"/>) into <paramref name="rounded"/>. Four values at a time where the machine
    /// has 256-bit vectors; the vector and scalar paths are the same IEEE operations, so the result does
    /// not depend on the machine.
    /// </summary>
    private static void RoundToGrid(double[] values, double[] rounded, double grid, double floor)
    {
        int n = values.Length, k = 0;
        if (Vector256.IsHardwareAccelerated)
        {
            var g = Vector256.Create(grid);
            var f = Vector256.Create(floor);
            for (; k <= n - Vector256<double>.Count; k += Vector256<double>.Count)
            {
                Vector256.Max(Vector256.Round(Vector256.LoadUnsafe(ref values[k]) / g) * g, f).StoreUnsafe(ref rounded[k]);
            }
        }
        for (; k < n; k++) rounded[k] = Math.Max(Math.Round(values[k] / grid) * grid, floor);
    }

    /// <summary>
    /// Takes the exact value instead of the rounded one where it still equals its first value
    /// (<paramref name="first"/>; once it differed, <paramref name="moved"/> remembers it); returns true if
    /// the result equals <paramref name="prepared"/>.
    /// </summary>
    private static bool KeepUnmovedValues(double[] values, double[] first, bool[] moved, double[] rounded, double[] prepared)
    {
        bool same = true;
        for (int k = 0; k < values.Length; k++)
        {
            moved[k] |= values[k] != first[k];
            if (!moved[k]) rounded[k] = values[k];
            same &= rounded[k] == prepared[k];
        }
        return same;
    }

    /// <summary>
    /// Rounded conditions as a dictionary key. The cache looks up with one probe that views the prepared
    /// conditions in place and stores a copy only on a miss, so a look-up allocates nothing.
    /// </summary>
    private sealed class ConditionsKey(double[] irradianceWm2, double[] temperatureC) : IEquatable<ConditionsKey>
    {
        private readonly double[] _irradianceWm2 = irradianceWm2, _temperatureC = temperatureC;
        private int _hash;

        /// <summary>Recomputes the hash after the viewed values changed: a weighted sum of all values (any mix of them serves; equality is checked in full).</summary>
        public void Refresh(double[] weights)
        {
            int n = _irradianceWm2.Length;
            _hash = (Dot(weights, 0, _irradianceWm2) + Dot(weights, n, _temperatureC)).GetHashCode();
        }

        /// <summary>sum of weights[offset + k] values[k], four terms at a time where the machine allows (only a hash: the order of the sum does not matter).</summary>
        private static double Dot(double[] weights, int offset, double[] values)
        {
            int n = values.Length, k = 0;
            double sum = 0;
            if (Vector256.IsHardwareAccelerated && n >= Vector256<double>.Count)
            {
                var acc = Vector256<double>.Zero;
                for (; k <= n - Vector256<double>.Count; k += Vector256<double>.Count)
                {
                    acc += Vector256.LoadUnsafe(ref weights[offset + k]) * Vector256.LoadUnsafe(ref values[k]);
                }
                sum = Vector256.Sum(acc);
            }
            for (; k < n; k++) sum += weights[offset + k] * values[k];
            return sum;
        }

        /// <summary>A key holding its own copy of the values, with the same hash.</summary>
        public ConditionsKey Copy() => new((double[])_irradianceWm2.Clone(), (double[])_temperatureC.Clone()) { _hash = _hash };

        public bool Equals(ConditionsKey? other) =>
            other is not null && _hash == other._hash
            && _irradianceWm2.AsSpan().SequenceEqual(other._irradianceWm2) && _temperatureC.AsSpan().SequenceEqual(other._temperatureC);

        public override bool Equals(object? obj) => Equals(obj as ConditionsKey);

        public override int GetHashCode() => _hash;
    }
}
