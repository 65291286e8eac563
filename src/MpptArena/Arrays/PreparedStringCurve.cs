using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// One string's characteristic tabulated at nodes in current and interpolated between them by monotone
/// piecewise-cubic Hermite interpolation in voltage (Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980).
/// </summary>
/// <remarks>
/// Each distinct substring is first tabulated on its own (<see cref="SubstringTable"/>), so a string
/// voltage at a current is a sum of table look-ups instead of a sum of Newton solves. Current nodes are a
/// uniform grid plus, around each distinct substring's short-circuit current, a geometric cluster (the
/// bypass diode turns on over a current excess that spans decades); every interval is then split until
/// the cubic misses the string voltage sum at its mid-current by less than the current tolerance.
/// </remarks>
internal sealed class PreparedStringCurve
{
    private const int UniformNodes = 48;
    private static readonly double[] ClusterOffsets = [3e-2, 3e-3, 3e-4, 1e-5];

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
    /// <param name="currentToleranceA">Largest current error [A] accepted at any interval's midpoint.</param>
    /// <param name="substringVoltageToleranceV">Voltage tolerance of each substring table [V].</param>
    /// <param name="tables">Cache of substring tables shared across preparations, or null.</param>
    public PreparedStringCurve(StringModel model, double lowCurrentA, double highCurrentA, double currentToleranceA, double substringVoltageToleranceV, SubstringTableCache? tables = null)
    {
        if (model.HasBlockingDiode)
        {
            (_blockingSaturationA, _blockingIdealityV) = model.BlockingDiode;
            lowCurrentA = Math.Max(lowCurrentA, -_blockingSaturationA * (1 - 1e-9));
        }
        var distinct = model.DistinctSubstrings;
        _tables = new SubstringTable[distinct.Count];
        for (int k = 0; k < distinct.Count; k++)
        {
            _tables[k] = tables is null
                ? new SubstringTable(distinct[k], lowCurrentA, highCurrentA, substringVoltageToleranceV)
                : tables.Get(distinct[k], lowCurrentA, highCurrentA, substringVoltageToleranceV);
        }
        _counts = model.Counts.ToArray();

        var currents = new List<double>(UniformNodes + distinct.Count * ClusterOffsets.Length * 2 + 2);
        for (int j = 0; j <= UniformNodes; j++) currents.Add(lowCurrentA + (highCurrentA - lowCurrentA) * j / UniformNodes);
        double scale = Math.Max(model.MaxShortCircuitCurrentA, 1e-6);
        foreach (var s in distinct)
        {
            double isc = s.ShortCircuitCurrentA;
            currents.Add(isc);
            foreach (double d in ClusterOffsets)
            {
                currents.Add(isc - d * scale);
                currents.Add(isc + d * scale);
            }
        }
        currents.RemoveAll(i => i <= lowCurrentA || i >= highCurrentA);
        currents.Add(lowCurrentA);
        currents.Add(highCurrentA);
        currents.Sort();
        currents.Reverse(); // descending current = ascending voltage

        var nodes = new List<Node>(currents.Count * 2);
        foreach (double i in currents)
        {
            var node = Solve(i);
            if (nodes.Count > 0 && node.VoltageV <= nodes[^1].VoltageV) continue; // coincident: nothing new
            nodes.Add(node);
        }
        nodes = Refine(nodes, currentToleranceA);

        int n = nodes.Count;
        _voltageV = new double[n];
        _currentA = new double[n];
        _slopeAPerV = new double[n];
        for (int k = 0; k < n; k++)
        {
            _voltageV[k] = nodes[k].VoltageV;
            _currentA[k] = nodes[k].CurrentA;
            _slopeAPerV[k] = nodes[k].SlopeAPerV;
        }
        MonotoneHermite.LimitSlopes(_voltageV, _currentA, _slopeAPerV);
        _cubic = new PiecewiseCubic(_voltageV, _currentA, _slopeAPerV);
        OpenCircuitVoltageV = StringVoltage(0.0, out _);
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

    private readonly record struct Node(double VoltageV, double CurrentA, double SlopeAPerV);

    /// <summary>String voltage from the substring tables [V] and dV/dI [V/A].</summary>
    private double StringVoltage(double currentA, out double slopeVPerA)
    {
        double v = 0, dv = 0;
        for (int k = 0; k < _tables.Length; k++)
        {
            v += _counts[k] * _tables[k].VoltageAtCurrent(currentA, out double s);
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

    private Node Solve(double currentA)
    {
        double v = StringVoltage(currentA, out double dVdI);
        return new Node(v, currentA, 1.0 / dVdI);
    }

    private List<Node> Refine(List<Node> nodes, double toleranceA)
    {
        const int MaxNodes = 50_000;
        // A cubic that matches at the nodes can cross the true curve exactly at a single test point, so
        // every interval is tested at a third and two thirds of its current span, and none may be wider
        // than 1/128 of the tabulated voltage range (found by the property tests: a 5.6 V interval over a
        // bypass knee once passed a midpoint test while missing the curve by 0.1 A).
        double maxWidthV = (nodes[^1].VoltageV - nodes[0].VoltageV) / 128.0;
        var result = new List<Node>(Math.Max(nodes.Count * 3, 256)) { nodes[0] };
        var work = new Stack<(Node A, Node B, int Depth)>(nodes.Count + 128);
        for (int k = nodes.Count - 2; k >= 0; k--) work.Push((nodes[k], nodes[k + 1], 0));
        while (work.Count > 0)
        {
            var (a, b, depth) = work.Pop();
            if (depth < 40 && result.Count + work.Count < MaxNodes)
            {
                var m1 = Solve(a.CurrentA + (b.CurrentA - a.CurrentA) / 3.0);
                var m2 = Solve(a.CurrentA + 2.0 * (b.CurrentA - a.CurrentA) / 3.0);
                bool inside = m1.VoltageV > a.VoltageV && m1.VoltageV < m2.VoltageV && m2.VoltageV < b.VoltageV;
                if (inside && (b.VoltageV - a.VoltageV > maxWidthV || Misses(a, b, m1, toleranceA) || Misses(a, b, m2, toleranceA)))
                {
                    work.Push((m2, b, depth + 1));
                    work.Push((m1, m2, depth + 1));
                    work.Push((a, m1, depth + 1));
                    continue;
                }
            }
            result.Add(b);
        }
        return result;
    }

    private static bool Misses(Node a, Node b, Node m, double toleranceA)
    {
        double h = b.VoltageV - a.VoltageV;
        double predicted = MonotoneHermite.Value((m.VoltageV - a.VoltageV) / h, h, a.CurrentA, b.CurrentA, a.SlopeAPerV, b.SlopeAPerV);
        return Math.Abs(predicted - m.CurrentA) > toleranceA;
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
