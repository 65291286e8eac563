using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// One string's characteristic I(V) as a monotone piecewise-cubic Hermite interpolant in voltage
/// (Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980), built from its substrings' tables.
/// </summary>
/// <remarks>
/// Each distinct substring is first tabulated on its own (<see cref="SubstringTable"/>: V(I) as a cubic
/// per interval, refined to its voltage tolerance). All substrings carry the string current, so the
/// string voltage is their sum at one current (Kirchhoff's voltage law); on every interval between
/// neighbouring nodes of all the tables each table is a single cubic, so the sum is known exactly, with
/// its slope, at the union of the tables' nodes. Of that union a node is kept unless it lies closer to
/// the previous kept node than half its own table's spacing there, so every region keeps the density of
/// the table that needs the most. One sweep in rising current carries the sum as a running cubic
/// (<see cref="AscendingCubicSum"/>: a node costs the same whatever the number of substrings, with a
/// bound on its rounding), and the string's I(V) is the Hermite interpolant through those
/// points with slopes 1/(dV/dI); no refinement is needed, as every substring's knee is present at the
/// density its own table needed (tests compare the result with the exact solve over random shading).
/// A blocking diode adds its closed-form drop, with nodes spread geometrically (eight per decade of
/// 1 + I/Is) from the range's lowest current to its highest, wherever its logarithm bends.
/// </remarks>
internal sealed class PreparedStringCurve
{
    private readonly double[] _voltageV;   // ascending
    private readonly double[] _currentA;   // descending with voltage
    private readonly double[] _slopeAPerV; // dI/dV at the nodes, monotonicity-limited
    private readonly SubstringTable[] _tables;
    private readonly int[] _counts;
    private readonly double _blockingSaturationA, _blockingIdealityV;
    private PiecewiseCubic? _cubic; // built on first use: a string combined with others is only swept

    /// <summary>Tabulates <paramref name="model"/> for string currents in [<paramref name="lowCurrentA"/>, <paramref name="highCurrentA"/>].</summary>
    /// <param name="model">Exact string model.</param>
    /// <param name="lowCurrentA">Lowest current [A] (negative: the string driven beyond open circuit).</param>
    /// <param name="highCurrentA">Highest current [A] (above every substring's short-circuit current).</param>
    /// <param name="substringVoltageToleranceV">Voltage tolerance of each substring table [V].</param>
    /// <param name="tables">Cache of substring tables shared across preparations, or null.</param>
    public PreparedStringCurve(StringModel model, double lowCurrentA, double highCurrentA, double substringVoltageToleranceV, SubstringTableCache? tables = null)
    {
        if (model.HasBlockingDiode)
        {
            (_blockingSaturationA, _blockingIdealityV) = model.BlockingDiode;
            lowCurrentA = Math.Max(lowCurrentA, -_blockingSaturationA * (1 - 1e-9));
        }
        var distinct = model.DistinctSubstrings;
        _tables = new SubstringTable[distinct.Count];
        int total = 2;
        for (int k = 0; k < distinct.Count; k++)
        {
            _tables[k] = tables is null
                ? new SubstringTable(distinct[k], lowCurrentA, highCurrentA, substringVoltageToleranceV)
                : tables.Get(distinct[k], lowCurrentA, highCurrentA, substringVoltageToleranceV);
            total += _tables[k].NodeCount;
        }
        _counts = model.Counts.ToArray();

        // Candidate nodes: the range ends, every table node inside the range, and for a blocking diode eight
        // nodes per decade of 1 + I/Is from 1e-9 (the range's lower end) up to the range's highest current
        // (for a diode with a small Is that is twenty decades: its logarithm bends over all of them, and the
        // tables' nodes are spaced for the substrings alone). A table node closer to the last node kept than
        // half its own table's spacing there is dropped: where every table is smooth their nodes interleave
        // far more densely than any of them needs, while at a knee the table that bends keeps all of its
        // nodes. One sweep in rising current visits them all and carries the string voltage as a running
        // cubic (AscendingCubicSum), so a node costs the same whatever the number of substrings.
        int blockingNodes = model.HasBlockingDiode
            ? 8 * (int)Math.Ceiling(9.0 + PortableMath.Log10(highCurrentA / _blockingSaturationA + 1.0))
            : 0;
        var cubics = new PiecewiseCubic[_tables.Length];
        var weights = new double[_tables.Length];
        for (int k = 0; k < _tables.Length; k++)
        {
            cubics[k] = _tables[k].VoltageOfCurrent;
            weights[k] = _counts[k];
        }
        var sum = new AscendingCubicSum(cubics, weights, lowCurrentA, 0.1 * substringVoltageToleranceV, 0.1 * substringVoltageToleranceV);
        var pool = System.Buffers.ArrayPool<double>.Shared;
        int capacity = total + blockingNodes + 2;
        var voltage = pool.Rent(capacity);
        var current = pool.Rent(capacity);
        var slope = pool.Rent(capacity);
        int n = 0;
        int blockingNode = 0;
        double nextBlockingA = NextBlockingNode(ref blockingNode, lowCurrentA);
        double lastKeptA = double.NaN;
        Keep(lowCurrentA);
        while (true)
        {
            double tableNodeA = sum.NextBreakpoint;
            if (nextBlockingA <= tableNodeA && nextBlockingA < highCurrentA)
            {
                sum.MoveTo(nextBlockingA);
                Keep(nextBlockingA);
                nextBlockingA = NextBlockingNode(ref blockingNode, nextBlockingA);
                continue;
            }
            if (tableNodeA >= highCurrentA) break;
            int k = sum.CrossNextBreakpoint();
            if (tableNodeA - lastKeptA >= _tables[k].HalfSpacingA[sum.PieceOf(k)]) Keep(tableNodeA);
        }
        sum.MoveTo(highCurrentA);
        Keep(highCurrentA);

        // Rising current must give falling voltage; a node that does not (coincident within rounding) adds nothing.
        void Keep(double i)
        {
            if (i == lastKeptA) return;
            lastKeptA = i;
            double v = sum.Value, dv = sum.Slope;
            if (_blockingSaturationA > 0)
            {
                v -= _blockingIdealityV * PortableMath.Log(i / _blockingSaturationA + 1.0);
                dv -= _blockingIdealityV / (i + _blockingSaturationA);
            }
            if (n > 0 && v >= voltage[n - 1]) return;
            voltage[n] = v;
            current[n] = i;
            slope[n] = 1.0 / dv;
            n++;
        }

        double NextBlockingNode(ref int d, double aboveA)
        {
            if (!model.HasBlockingDiode) return double.PositiveInfinity;
            for (; d <= blockingNodes; d++)
            {
                double c = _blockingSaturationA * (PortableMath.Exp10(d / 8.0 - 9.0) - 1.0);
                if (c > aboveA) return c;
            }
            return double.PositiveInfinity;
        }
        FreshEvaluations = sum.FreshEvaluations;

        // Stored from the end so that voltage ascends.
        _voltageV = new double[n];
        _currentA = new double[n];
        _slopeAPerV = new double[n];
        for (int k = 0; k < n; k++)
        {
            _voltageV[k] = voltage[n - 1 - k];
            _currentA[k] = current[n - 1 - k];
            _slopeAPerV[k] = slope[n - 1 - k];
        }
        pool.Return(voltage);
        pool.Return(current);
        pool.Return(slope);
        MonotoneHermite.LimitSlopes(_voltageV, _currentA, _slopeAPerV);
        OpenCircuitVoltageV = StringVoltage(0.0);
    }

    /// <summary>Lowest tabulated voltage [V].</summary>
    public double MinVoltageV => _voltageV[0];

    /// <summary>Highest tabulated voltage [V].</summary>
    public double MaxVoltageV => _voltageV[^1];

    /// <summary>String voltage at zero current [V].</summary>
    public double OpenCircuitVoltageV { get; }

    /// <summary>Number of nodes.</summary>
    public int NodeCount => _voltageV.Length;

    /// <summary>How often the preparation sweep evaluated every substring table afresh (the rest were running-sum steps).</summary>
    public int FreshEvaluations { get; }

    /// <summary>Tabulated node voltages [V], ascending.</summary>
    public ReadOnlySpan<double> NodeVoltagesV => _voltageV;

    /// <summary>String voltage from the substring tables [V] at one current [A].</summary>
    private double StringVoltage(double currentA)
    {
        double v = 0;
        for (int k = 0; k < _tables.Length; k++) v += _counts[k] * _tables[k].VoltageOfCurrent.EvaluateOnce(currentA);
        if (_blockingSaturationA > 0) v -= _blockingIdealityV * PortableMath.Log(currentA / _blockingSaturationA + 1.0);
        return v;
    }

    /// <summary>
    /// The characteristic of <paramref name="count"/> such strings in parallel as a fast piecewise cubic
    /// (the same nodes, currents and slopes times the count); the string's own for a count of one.
    /// </summary>
    public PiecewiseCubic ToCubic(int count = 1)
    {
        if (count == 1) return Cubic;
        var current = new double[_currentA.Length];
        var slope = new double[_slopeAPerV.Length];
        for (int k = 0; k < current.Length; k++)
        {
            current[k] = count * _currentA[k];
            slope[k] = count * _slopeAPerV[k];
        }
        return new PiecewiseCubic(_voltageV, current, slope);
    }

    /// <summary>String current [A] at voltage [V] and dI/dV [A/V].</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV) => Cubic.Evaluate(voltageV, out slopeAPerV);

    private PiecewiseCubic Cubic
    {
        get
        {
            var cubic = _cubic;
            if (cubic is null)
            {
                // Built on first use; two threads may both build it, and either whole one is kept.
                cubic = new PiecewiseCubic(_voltageV, _currentA, _slopeAPerV);
                Volatile.Write(ref _cubic, cubic);
            }
            return cubic;
        }
    }

    /// <summary>
    /// String current [A] and dI/dV [A/V] for a sweep in ascending voltage [V], straight from the nodes (the
    /// same Hermite cubics); <paramref name="interval"/> carries the position (start at 0). Linear beyond the ends.
    /// </summary>
    internal double CurrentAtRisingVoltage(double voltageV, ref int interval, out double slopeAPerV)
    {
        var x = _voltageV;
        if (voltageV <= x[0] || voltageV >= x[^1])
        {
            int end = voltageV <= x[0] ? 0 : x.Length - 1;
            slopeAPerV = _slopeAPerV[end];
            return _currentA[end] + slopeAPerV * (voltageV - x[end]);
        }
        int j = interval;
        while (voltageV > x[j + 1]) j++;
        interval = j;
        if (voltageV == x[j + 1])
        {
            // A node of this string (the other strings' nodes fall in between): its own value and slope.
            slopeAPerV = _slopeAPerV[j + 1];
            return _currentA[j + 1];
        }
        double h = x[j + 1] - x[j], t = (voltageV - x[j]) / h;
        slopeAPerV = MonotoneHermite.Slope(t, h, _currentA[j], _currentA[j + 1], _slopeAPerV[j], _slopeAPerV[j + 1]);
        return MonotoneHermite.Value(t, h, _currentA[j], _currentA[j + 1], _slopeAPerV[j], _slopeAPerV[j + 1]);
    }
}
