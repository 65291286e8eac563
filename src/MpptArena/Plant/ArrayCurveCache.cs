using MpptArena.Arrays;

namespace MpptArena.Plant;

/// <summary>
/// Keeps the prepared array curve and its true MPP for the conditions in force, and re-prepares only
/// when some substring's irradiance or temperature has moved beyond a threshold since the last preparation.
/// </summary>
/// <remarks>
/// Error bound of the rule: between preparations every substring's irradiance is within dG of the
/// prepared value, so its photocurrent is within dG/G_ref IL_ref (De Soto 2006, eq. 3: IL is linear in G)
/// and the array current at any voltage within about n_parallel dG/G_ref Isc_ref; the power error is
/// at most V times that. With dG = 1 W/m2 this is 0.1 % of Isc; the test
/// <c>ReprepareRuleBoundsPowerError</c> checks the bound against the exact solve.
/// </remarks>
public sealed class ArrayCurveCache
{
    private readonly PvArray _array;
    private readonly double _irradianceThresholdWm2, _temperatureThresholdC;
    private readonly ArrayConditions _prepared;
    private readonly SubstringTableCache _tables = new();
    private bool _hasCurve;

    /// <summary>A cache for <paramref name="array"/> with the given thresholds.</summary>
    public ArrayCurveCache(PvArray array, double irradianceThresholdWm2, double temperatureThresholdC)
    {
        _array = array;
        _irradianceThresholdWm2 = irradianceThresholdWm2;
        _temperatureThresholdC = temperatureThresholdC;
        _prepared = new ArrayConditions(array.Layout.SubstringCount);
    }

    /// <summary>The prepared curve in force.</summary>
    public PreparedArrayCurve Curve { get; private set; } = null!;

    /// <summary>Its local and global maxima.</summary>
    public PowerPeaks Peaks { get; private set; } = PowerPeaks.None;

    /// <summary>Substring tables built and reused so far.</summary>
    public SubstringTableCache Tables => _tables;

    /// <summary>Preparations so far.</summary>
    public int Preparations { get; private set; }

    /// <summary>Conditions of the curve in force.</summary>
    public ArrayConditions PreparedConditions => _prepared;

    /// <summary>Re-prepares if <paramref name="conditions"/> moved beyond the thresholds; returns true if it did.</summary>
    public bool Update(ArrayConditions conditions)
    {
        if (_hasCurve && !MovedBeyondThreshold(conditions)) return false;
        _prepared.CopyFrom(conditions);
        Curve = new PreparedArrayCurve(_array.Solve(_prepared), _tables);
        Peaks = MppSearch.FindPeaks(Curve, Math.Max(400, 25 * _array.Layout.SubstringsPerString));
        Preparations++;
        _hasCurve = true;
        return true;
    }

    private bool MovedBeyondThreshold(ArrayConditions c)
    {
        for (int k = 0; k < c.IrradianceWm2.Length; k++)
        {
            if (Math.Abs(c.IrradianceWm2[k] - _prepared.IrradianceWm2[k]) > _irradianceThresholdWm2) return true;
            if (Math.Abs(c.CellTemperatureC[k] - _prepared.CellTemperatureC[k]) > _temperatureThresholdC) return true;
        }
        return false;
    }
}
