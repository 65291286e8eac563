using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// One substring's characteristic tabulated for fast inverse evaluation, V(I). The nodes are placed in
/// voltage, where the characteristic is explicit (I(V) = I_cells(V) + I_bypass(V): one Lambert W per
/// node, no iteration), and refined until the monotone cubic in current misses the exact curve by less
/// than the voltage tolerance at every interval's midpoint.
/// </summary>
/// <remarks>Interpolation: piecewise-cubic Hermite with exact slopes limited for monotonicity
/// (Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980).</remarks>
internal sealed class SubstringTable
{
    private readonly double[] _currentA;  // ascending
    private readonly double[] _voltageV;  // descending
    private readonly double[] _slopeVPerA;

    /// <summary>Tabulates <paramref name="model"/> for currents in [<paramref name="lowCurrentA"/>, <paramref name="highCurrentA"/>].</summary>
    public SubstringTable(in SubstringModel model, double lowCurrentA, double highCurrentA, double voltageToleranceV)
    {
        // The range ends need only bracket the currents, not hit them: the cells' closed-form voltage at
        // the lowest current (the bypass diode only leaks there), and at the highest the voltage at which
        // the diode alone would carry the excess over the cells' short-circuit current.
        double vHigh = Math.Max(Pv.SingleDiodeModel.VoltageAtCurrent(model.Cells, lowCurrentA), model.BypassIdealityVoltageV);
        double excess = Math.Max(highCurrentA - model.ShortCircuitCurrentA, 1e-12);
        double vLow = -model.BypassIdealityVoltageV * Math.Log(excess / model.BypassSaturationCurrentA + 1.0) - model.BypassIdealityVoltageV;
        var seeds = new List<double> { vLow, vHigh, 0.0 };
        const int uniform = 12;
        for (int k = 1; k < uniform; k++) seeds.Add(vLow + (vHigh - vLow) * k / uniform);
        // The bypass diode turns on over a few tenths of a volt below zero.
        double nvt = model.BypassIdealityVoltageV;
        foreach (double m in new[] { 1.0, 3.0, 6.0, 10.0 }) seeds.Add(-m * nvt);
        seeds.RemoveAll(v => v < vLow || v > vHigh);
        seeds.Sort();
        var nodes = new List<Node>(64);
        foreach (double v in seeds.Distinct()) nodes.Add(Evaluate(model, v));

        var result = new List<Node>(128) { nodes[0] };
        var work = new Stack<(Node A, Node B, int Depth)>();
        for (int k = nodes.Count - 2; k >= 0; k--) work.Push((nodes[k], nodes[k + 1], 0));
        while (work.Count > 0)
        {
            var (a, b, depth) = work.Pop();
            var m = Evaluate(model, 0.5 * (a.VoltageV + b.VoltageV));
            bool inside = m.CurrentA < a.CurrentA && m.CurrentA > b.CurrentA;
            if (inside && depth < 40)
            {
                double predicted = Hermite(b, a, m.CurrentA);
                if (Math.Abs(predicted - m.VoltageV) > voltageToleranceV)
                {
                    work.Push((m, b, depth + 1));
                    work.Push((a, m, depth + 1));
                    continue;
                }
            }
            result.Add(b);
        }
        // Store in ascending current (descending voltage).
        result.Reverse();
        int n = result.Count;
        _currentA = new double[n];
        _voltageV = new double[n];
        _slopeVPerA = new double[n];
        for (int k = 0; k < n; k++)
        {
            _currentA[k] = result[k].CurrentA;
            _voltageV[k] = result[k].VoltageV;
            _slopeVPerA[k] = result[k].SlopeVPerA;
        }
        MonotoneHermite.LimitSlopes(_currentA, _voltageV, _slopeVPerA);
    }

    /// <summary>Nodes in the table.</summary>
    public int NodeCount => _currentA.Length;

    private readonly record struct Node(double VoltageV, double CurrentA, double SlopeVPerA);

    private static Node Evaluate(in SubstringModel model, double v)
    {
        double i = model.CurrentAndSlopeAtVoltage(v, out double slope);
        return new Node(v, i, 1.0 / slope);
    }

    private static double Hermite(Node lo, Node hi, double i)
    {
        double h = hi.CurrentA - lo.CurrentA;
        double t = (i - lo.CurrentA) / h;
        return MonotoneHermite.Value(t, h, lo.VoltageV, hi.VoltageV, lo.SlopeVPerA, hi.SlopeVPerA);
    }

    /// <summary>Substring voltage [V] at current [A] and dV/dI [V/A]; <paramref name="hint"/> is the interval of the previous call, kept by the caller for monotone sweeps.</summary>
    public double VoltageAtCurrent(double currentA, out double slopeVPerA, ref int hint)
    {
        var c = _currentA;
        int last = c.Length - 1;
        if (currentA <= c[0])
        {
            slopeVPerA = _slopeVPerA[0];
            hint = 0;
            return _voltageV[0] + slopeVPerA * (currentA - c[0]);
        }
        if (currentA >= c[last])
        {
            slopeVPerA = _slopeVPerA[last];
            hint = last - 1;
            return _voltageV[last] + slopeVPerA * (currentA - c[last]);
        }
        int j = hint;
        if (j < 0 || j >= last || currentA < c[j] || currentA > c[j + 1])
        {
            // Short walk first (sweeps move a few intervals at a time), then bisection.
            if (j >= 0 && j < last && currentA > c[j + 1] && j + 2 <= last && currentA <= c[j + 2]) j++;
            else if (j > 0 && j <= last && currentA < c[j] && currentA >= c[j - 1]) j--;
            else
            {
                j = Array.BinarySearch(c, currentA);
                if (j < 0) j = ~j - 1;
                j = Math.Clamp(j, 0, last - 1);
            }
        }
        hint = j;
        double h = c[j + 1] - c[j];
        double t = (currentA - c[j]) / h;
        slopeVPerA = MonotoneHermite.Slope(t, h, _voltageV[j], _voltageV[j + 1], _slopeVPerA[j], _slopeVPerA[j + 1]);
        return MonotoneHermite.Value(t, h, _voltageV[j], _voltageV[j + 1], _slopeVPerA[j], _slopeVPerA[j + 1]);
    }
}
