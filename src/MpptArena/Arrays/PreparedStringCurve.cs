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
/// the table that needs the most. One sweep in rising current evaluates the sum at the kept nodes (each
/// table walks forward, no search), and the string's I(V) is the Hermite interpolant through those
/// points with slopes 1/(dV/dI); no refinement is needed, as every substring's knee is present at the
/// density its own table needed (tests compare the result with the exact solve over random shading).
/// A blocking diode adds its closed-form drop, with nodes spread geometrically (eight per decade) over
/// the decades of current where its logarithm bends.
/// </remarks>
internal sealed class PreparedStringCurve
{
    private readonly double[] _voltageV;   // ascending
    private readonly double[] _currentA;   // descending with voltage
    private readonly double[] _slopeAPerV; // dI/dV at the nodes, monotonicity-limited
    private readonly SubstringTable[] _tables;
    private readonly int[] _counts;
    private readonly double _blockingSaturationA, _blockingIdealityV;
    private readonly PiecewiseCubic _cubic;

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

        // The union of all table nodes inside the range, and the range ends, each with the spacing its own
        // table has there. A node closer than half that spacing to the last one kept is dropped: where every
        // table is smooth their nodes interleave far more densely than any of them needs, while at a knee
        // the table that bends keeps all of its nodes.
        // A blocking diode's drop n Vt ln(1 + I/Is) bends over many decades of 1 + I/Is: eight nodes per decade
        // from 1e-9 (the range's lower end) to 1e10.
        const int BlockingNodes = 8 * 19;
        int capacity = total + (model.HasBlockingDiode ? BlockingNodes + 1 : 0);
        var union = new double[capacity];
        var spacing = new double[capacity];
        int u = 0;
        union[u] = lowCurrentA; spacing[u++] = 0;
        union[u] = highCurrentA; spacing[u++] = 0;
        foreach (var table in _tables)
        {
            var nodesA = table.NodeCurrentsA;
            for (int j = 0; j < nodesA.Length; j++)
            {
                double c = nodesA[j];
                if (c <= lowCurrentA || c >= highCurrentA) continue;
                double left = j > 0 ? c - nodesA[j - 1] : double.PositiveInfinity;
                double right = j + 1 < nodesA.Length ? nodesA[j + 1] - c : double.PositiveInfinity;
                union[u] = c;
                spacing[u++] = Math.Min(left, right);
            }
        }
        if (model.HasBlockingDiode)
        {
            for (int d = 0; d <= BlockingNodes; d++)
            {
                double c = _blockingSaturationA * (Math.Pow(10.0, d / 8.0 - 9.0) - 1.0);
                if (c > lowCurrentA && c < highCurrentA) { union[u] = c; spacing[u++] = 0; }
            }
        }
        Array.Sort(union, spacing, 0, u);
        int kept = 0;
        for (int m = 0; m < u; m++)
        {
            if (m == u - 1 || kept == 0 || union[m] - union[kept - 1] >= 0.5 * spacing[m])
            {
                union[kept++] = union[m];
            }
        }
        u = kept;

        // One sweep in rising current; stored from the end so that voltage ascends.
        var voltage = new double[u];
        var current = new double[u];
        var slope = new double[u];
        var intervals = new int[_tables.Length];
        int n = 0;
        double previousI = double.NaN;
        for (int m = 0; m < u; m++)
        {
            double i = union[m];
            if (i == previousI) continue;
            previousI = i;
            double v = StringVoltage(i, intervals, out double dv);
            // Rising current must give falling voltage; a node that does not (coincident within rounding) adds nothing.
            if (n > 0 && v >= voltage[n - 1]) continue;
            voltage[n] = v;
            current[n] = i;
            slope[n] = 1.0 / dv;
            n++;
        }
        _voltageV = new double[n];
        _currentA = new double[n];
        _slopeAPerV = new double[n];
        for (int k = 0; k < n; k++)
        {
            _voltageV[k] = voltage[n - 1 - k];
            _currentA[k] = current[n - 1 - k];
            _slopeAPerV[k] = slope[n - 1 - k];
        }
        MonotoneHermite.LimitSlopes(_voltageV, _currentA, _slopeAPerV);
        _cubic = new PiecewiseCubic(_voltageV, _currentA, _slopeAPerV);
        OpenCircuitVoltageV = StringVoltage(0.0, null, out _);
    }

    /// <summary>Lowest tabulated voltage [V].</summary>
    public double MinVoltageV => _voltageV[0];

    /// <summary>Highest tabulated voltage [V].</summary>
    public double MaxVoltageV => _voltageV[^1];

    /// <summary>String voltage at zero current [V].</summary>
    public double OpenCircuitVoltageV { get; }

    /// <summary>Number of nodes.</summary>
    public int NodeCount => _voltageV.Length;

    /// <summary>Nodes of all substring tables.</summary>
    public int SubstringNodeCount => _tables.Sum(t => t.NodeCount);

    /// <summary>Tabulated node voltages [V], ascending.</summary>
    public ReadOnlySpan<double> NodeVoltagesV => _voltageV;

    /// <summary>
    /// String voltage from the substring tables [V] and dV/dI [V/A]. With <paramref name="intervals"/> (one
    /// per table, starting at 0) the calls must come in rising current and the tables walk forward.
    /// </summary>
    private double StringVoltage(double currentA, int[]? intervals, out double slopeVPerA)
    {
        double v = 0, dv = 0;
        for (int k = 0; k < _tables.Length; k++)
        {
            double s;
            v += _counts[k] * (intervals is null
                ? _tables[k].VoltageAtCurrent(currentA, out s)
                : _tables[k].VoltageAtRisingCurrent(currentA, ref intervals[k], out s));
            dv += _counts[k] * s;
        }
        if (_blockingSaturationA > 0)
        {
            v -= _blockingIdealityV * Math.Log(currentA / _blockingSaturationA + 1.0);
            dv -= _blockingIdealityV / (currentA + _blockingSaturationA);
        }
        slopeVPerA = dv;
        return v;
    }

    /// <summary>
    /// The characteristic of <paramref name="count"/> such strings in parallel as a fast piecewise cubic
    /// (the same nodes, currents and slopes times the count); the string's own for a count of one.
    /// </summary>
    public PiecewiseCubic ToCubic(int count = 1)
    {
        if (count == 1) return _cubic;
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
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV) => _cubic.Evaluate(voltageV, out slopeAPerV);
}
