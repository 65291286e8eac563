namespace MpptArena.Arrays;

/// <summary>
/// One string's characteristic tabulated at exact nodes and interpolated between them by monotone
/// piecewise-cubic Hermite interpolation in voltage, with the exact slopes at the nodes limited so
/// the interpolant never leaves the node values (F. N. Fritsch, R. E. Carlson, "Monotone piecewise
/// cubic interpolation", SIAM J. Numer. Anal. 17(2), 1980, 238-246).
/// </summary>
/// <remarks>
/// Nodes are placed in current, where the knees of a shaded string are known in advance: a uniform
/// grid plus, around each distinct substring's short-circuit current, a geometric cluster (the
/// bypass diode turns on over a current excess that spans decades). Node voltages are exact
/// (<see cref="StringModel.VoltageAtCurrent"/>).
/// </remarks>
internal sealed class PreparedStringCurve
{
    private const int UniformNodes = 64;
    private static readonly double[] ClusterOffsets = BuildClusterOffsets();

    private readonly double[] _voltageV;   // ascending
    private readonly double[] _currentA;   // descending with voltage
    private readonly double[] _slopeAPerV; // dI/dV at the nodes, monotonicity-limited

    /// <summary>Tabulates <paramref name="model"/> between <paramref name="minVoltageV"/> and <paramref name="maxVoltageV"/>.</summary>
    /// <param name="model">Exact string model.</param>
    /// <param name="minVoltageV">Lowest voltage to tabulate [V].</param>
    /// <param name="maxVoltageV">Highest voltage to tabulate [V].</param>
    /// <param name="currentToleranceA">Largest current error [A] accepted at the midpoint of any interval.</param>
    public PreparedStringCurve(StringModel model, double minVoltageV, double maxVoltageV, double currentToleranceA)
    {
        double iLow = model.CurrentAtVoltage(maxVoltageV);
        double iHigh = model.CurrentAtVoltage(minVoltageV);
        var currents = new List<double>(UniformNodes + model.DistinctSubstrings.Count * ClusterOffsets.Length * 2);
        for (int j = 0; j <= UniformNodes; j++) currents.Add(iLow + (iHigh - iLow) * j / UniformNodes);
        double scale = Math.Max(model.MaxShortCircuitCurrentA, 1e-6);
        foreach (var s in model.DistinctSubstrings)
        {
            double isc = s.ShortCircuitCurrentA;
            currents.Add(isc);
            foreach (double d in ClusterOffsets)
            {
                currents.Add(isc - d * scale);
                currents.Add(isc + d * scale);
            }
        }
        currents.RemoveAll(i => i <= iLow || i >= iHigh);
        currents.Add(iLow);
        currents.Add(iHigh);
        currents.Sort();
        currents.Reverse(); // descending current = ascending voltage

        var nodes = new List<Node>(currents.Count * 2);
        foreach (double i in currents)
        {
            var node = Solve(model, i);
            if (nodes.Count > 0 && node.VoltageV <= nodes[^1].VoltageV) continue; // coincident: nothing new
            nodes.Add(node);
        }
        Refine(model, nodes, currentToleranceA);

        _voltageV = nodes.Select(n => n.VoltageV).ToArray();
        _currentA = nodes.Select(n => n.CurrentA).ToArray();
        _slopeAPerV = nodes.Select(n => n.SlopeAPerV).ToArray();
        LimitSlopes();
    }

    private readonly record struct Node(double VoltageV, double CurrentA, double SlopeAPerV);

    private static Node Solve(StringModel model, double currentA)
    {
        double v = model.VoltageAtCurrent(currentA, out double dVdI);
        return new Node(v, currentA, 1.0 / dVdI);
    }

    /// <summary>
    /// Splits every interval whose cubic misses the exact curve at its mid-current by more than the
    /// tolerance, until none does: the error bound is checked, not assumed.
    /// </summary>
    private static void Refine(StringModel model, List<Node> nodes, double toleranceA)
    {
        const int MaxNodes = 50_000;
        var pending = new Stack<int>();
        for (int k = nodes.Count - 2; k >= 0; k--) pending.Push(k);
        var result = new List<Node>(nodes.Count * 2) { nodes[0] };
        // Work left to right: each interval is split until it passes, then emitted.
        var work = new Stack<(Node A, Node B, int Depth)>();
        for (int k = nodes.Count - 2; k >= 0; k--) work.Push((nodes[k], nodes[k + 1], 0));
        while (work.Count > 0)
        {
            var (a, b, depth) = work.Pop();
            double mid = 0.5 * (a.CurrentA + b.CurrentA);
            var m = Solve(model, mid);
            bool inside = m.VoltageV > a.VoltageV && m.VoltageV < b.VoltageV;
            double predicted = inside ? HermiteValue(a, b, m.VoltageV) : mid;
            if (inside && Math.Abs(predicted - mid) > toleranceA && depth < 40 && result.Count + work.Count < MaxNodes)
            {
                work.Push((m, b, depth + 1));
                work.Push((a, m, depth + 1));
                continue;
            }
            result.Add(b);
        }
        nodes.Clear();
        nodes.AddRange(result);
    }

    private static double HermiteValue(Node a, Node b, double x)
    {
        double h = b.VoltageV - a.VoltageV;
        double t = (x - a.VoltageV) / h;
        double t2 = t * t, t3 = t2 * t;
        return (2 * t3 - 3 * t2 + 1) * a.CurrentA + (t3 - 2 * t2 + t) * a.SlopeAPerV * h
               + (-2 * t3 + 3 * t2) * b.CurrentA + (t3 - t2) * b.SlopeAPerV * h;
    }

    /// <summary>Lowest tabulated voltage [V].</summary>
    public double MinVoltageV => _voltageV[0];

    /// <summary>Highest tabulated voltage [V].</summary>
    public double MaxVoltageV => _voltageV[^1];

    /// <summary>Number of nodes.</summary>
    public int NodeCount => _voltageV.Length;

    /// <summary>Tabulated node voltages [V], ascending.</summary>
    public ReadOnlySpan<double> NodeVoltagesV => _voltageV;

    /// <summary>String current [A] at voltage [V] and dI/dV [A/V].</summary>
    public double CurrentAtVoltage(double voltageV, out double slopeAPerV)
    {
        var vs = _voltageV;
        int last = vs.Length - 1;
        if (voltageV <= vs[0])
        {
            slopeAPerV = _slopeAPerV[0];
            return _currentA[0] + slopeAPerV * (voltageV - vs[0]);
        }
        if (voltageV >= vs[last])
        {
            slopeAPerV = _slopeAPerV[last];
            return _currentA[last] + slopeAPerV * (voltageV - vs[last]);
        }
        int j = Array.BinarySearch(vs, voltageV);
        if (j < 0) j = ~j - 1;
        return Hermite(j, voltageV, out slopeAPerV);
    }


    private double Hermite(int j, double x, out double slope)
    {
        double h = _voltageV[j + 1] - _voltageV[j];
        double t = (x - _voltageV[j]) / h;
        double y0 = _currentA[j], y1 = _currentA[j + 1];
        double m0 = _slopeAPerV[j] * h, m1 = _slopeAPerV[j + 1] * h;
        double t2 = t * t, t3 = t2 * t;
        double h00 = 2 * t3 - 3 * t2 + 1, h10 = t3 - 2 * t2 + t, h01 = -2 * t3 + 3 * t2, h11 = t3 - t2;
        slope = ((6 * t2 - 6 * t) * (y0 - y1) + (3 * t2 - 4 * t + 1) * m0 + (3 * t2 - 2 * t) * m1) / h;
        return h00 * y0 + h10 * m0 + h01 * y1 + h11 * m1;
    }

    private void LimitSlopes()
    {
        // Fritsch & Carlson (1980): with secant delta_k, alpha = m_k/delta_k and beta = m_{k+1}/delta_k
        // inside the circle alpha^2 + beta^2 <= 9 keep the cubic monotone.
        for (int k = 0; k + 1 < _voltageV.Length; k++)
        {
            double delta = (_currentA[k + 1] - _currentA[k]) / (_voltageV[k + 1] - _voltageV[k]);
            if (delta == 0)
            {
                _slopeAPerV[k] = 0;
                _slopeAPerV[k + 1] = 0;
                continue;
            }
            double alpha = _slopeAPerV[k] / delta, beta = _slopeAPerV[k + 1] / delta;
            if (alpha < 0) { _slopeAPerV[k] = 0; alpha = 0; }
            if (beta < 0) { _slopeAPerV[k + 1] = 0; beta = 0; }
            double r = alpha * alpha + beta * beta;
            if (r > 9)
            {
                double tau = 3 / Math.Sqrt(r);
                _slopeAPerV[k] = tau * alpha * delta;
                _slopeAPerV[k + 1] = tau * beta * delta;
            }
        }
    }

    private static double[] BuildClusterOffsets()
    {
        var list = new List<double>();
        for (double e = -1.0; e >= -7.0; e -= 0.5) list.Add(Math.Pow(10, e));
        return list.ToArray();
    }
}
