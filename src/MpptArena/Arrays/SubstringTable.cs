using MpptArena.Numerics;

namespace MpptArena.Arrays;

/// <summary>
/// One substring's characteristic tabulated for fast inverse evaluation, V(I). The nodes are placed in
/// the cells' diode voltage Vd = V + I Rs, along which the whole characteristic is explicit (no Lambert W,
/// no iteration): I_cells = IL - I0 [exp(Vd/a) - 1] - Vd/Rsh, V = Vd - I_cells Rs, and the bypass diode
/// adds Is [exp(-V/(n Vt)) - 1] at that terminal voltage. V rises strictly with Vd
/// (dV/dVd = 1 + Rs (I0/a exp(Vd/a) + 1/Rsh) &gt; 0), so the nodes come out ordered. They are refined until
/// the monotone cubic in current misses the exact curve by less than the voltage tolerance at every
/// interval's midpoint.
/// </summary>
/// <remarks>Single-diode model: De Soto, Klein and Beckman, Solar Energy 80 (2006) 78-88, eq. 1.
/// Interpolation: piecewise-cubic Hermite with exact slopes limited for monotonicity
/// (Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980).</remarks>
[System.Runtime.CompilerServices.SkipLocalsInit]
internal sealed class SubstringTable
{
    private readonly PiecewiseCubic _voltageOfCurrent; // nodes ascending in current

    /// <summary>
    /// Share of the tolerance an interval's midpoint may use: the error of a cubic between its nodes peaks
    /// near, not at, the midpoint, so the midpoint check keeps a margin that holds the whole interval within
    /// the tolerance (tested on 2001 points per table).
    /// </summary>
    private const double MidpointShare = 0.9;

    /// <summary>Tabulates <paramref name="model"/> for currents in [<paramref name="lowCurrentA"/>, <paramref name="highCurrentA"/>].</summary>
    public SubstringTable(in SubstringModel model, double lowCurrentA, double highCurrentA, double voltageToleranceV)
    {
        // The range ends need only bracket the currents, not hit them, and both come in closed form in the
        // diode voltage. Top: where the diode alone, I0 (exp(Vd/a) - 1), takes IL - lowest current (the shunt
        // only lowers the current further), and at least where V = n Vt (Vd = n Vt + IL Rs gives
        // V >= n Vt, since the cells carry at most IL for Vd >= 0). Bottom: the voltage at which the bypass
        // diode alone would carry the excess over the cells' short-circuit current, and a diode voltage at
        // which the terminal voltage is surely below it: for Vd <= 0 the cells carry at least IL - Gsh Vd, so
        // V <= Vd (1 + Gsh Rs) - IL Rs.
        var constants = new Constants(model);
        var cells = model.Cells;
        double rs = cells.SeriesResistanceOhm;
        double nvt = model.BypassIdealityVoltageV;
        double il = cells.PhotocurrentA;
        double vdHigh = Math.Max(
            cells.ModifiedIdealityV * PortableMath.Log(Math.Max(il - lowCurrentA, 0.0) / cells.SaturationCurrentA + 1.0),
            nvt + Math.Max(il, 0.0) * rs);
        double excess = Math.Max(highCurrentA - model.ShortCircuitCurrentA, 1e-12);
        double vLow = -nvt * PortableMath.Log(excess / model.BypassSaturationCurrentA + 1.0) - nvt;
        double vdLow = (vLow + il * rs) / (1.0 + cells.ShuntConductanceS * rs);
        if (vdLow > 0) vdLow = vLow + Pv.SingleDiodeModel.CurrentAtVoltage(cells, vLow) * rs; // only for an extreme Rs

        // Seeds: a uniform spread, plus where the bypass diode turns on, a few tenths of a volt below
        // zero terminal voltage (Vd is about V + Isc Rs there; seeds only guide the refinement).
        double shift = model.ShortCircuitCurrentA * rs;
        Span<double> seeds = stackalloc double[20];
        int count = 0;
        const int uniform = 12;
        seeds[count++] = vdLow;
        seeds[count++] = vdHigh;
        for (int k = 1; k < uniform; k++) seeds[count++] = vdLow + (vdHigh - vdLow) * k / uniform;
        seeds[count++] = shift;
        foreach (double m in (ReadOnlySpan<double>)[1.0, 3.0, 6.0, 10.0]) seeds[count++] = shift - m * nvt;
        seeds = seeds[..count];
        seeds.Sort();

        // Depth-first refinement, left to right: the stack holds the pending right ends (at most the
        // seeds plus one per level of depth), the left end is the last node accepted.
        const int MaxDepth = 40;
        Span<Node> pending = stackalloc Node[seeds.Length + MaxDepth + 1];
        Span<int> depths = stackalloc int[seeds.Length + MaxDepth + 1];
        int top = 0;
        for (int k = seeds.Length - 1; k >= 0; k--)
        {
            double vd = seeds[k];
            if (vd < vdLow || vd > vdHigh || (top > 0 && vd >= pending[top - 1].DiodeVoltageV)) continue;
            pending[top] = Evaluate(constants, vd);
            depths[top++] = 0;
        }
        var accepted = System.Buffers.ArrayPool<Node>.Shared.Rent(128);
        int n = 0;
        accepted[n++] = pending[--top];
        while (top > 0)
        {
            ref readonly Node a = ref accepted[n - 1];
            ref readonly Node b = ref pending[top - 1];
            int depth = depths[top - 1];
            var m = Midpoint(constants, a, b);
            bool inside = m.CurrentA < a.CurrentA && m.CurrentA > b.CurrentA;
            if (inside && depth < MaxDepth && Math.Abs(Hermite(b, a, m.CurrentA) - m.VoltageV) > MidpointShare * voltageToleranceV)
            {
                depths[top - 1] = depth + 1;
                pending[top] = m;
                depths[top++] = depth + 1;
                continue;
            }
            if (n == accepted.Length)
            {
                var larger = System.Buffers.ArrayPool<Node>.Shared.Rent(2 * n);
                accepted.AsSpan(0, n).CopyTo(larger);
                System.Buffers.ArrayPool<Node>.Shared.Return(accepted);
                accepted = larger;
            }
            accepted[n++] = b;
            top--;
        }
        // Store in ascending current (descending voltage); the cubic keeps its own copy.
        Span<double> currentA = n <= 256 ? stackalloc double[n] : new double[n];
        Span<double> voltageV = n <= 256 ? stackalloc double[n] : new double[n];
        Span<double> slopeVPerA = n <= 256 ? stackalloc double[n] : new double[n];
        for (int k = 0; k < n; k++)
        {
            var node = accepted[n - 1 - k];
            currentA[k] = node.CurrentA;
            voltageV[k] = node.VoltageV;
            slopeVPerA[k] = node.SlopeVPerA;
        }
        System.Buffers.ArrayPool<Node>.Shared.Return(accepted);
        MonotoneHermite.LimitSlopes(currentA, voltageV, slopeVPerA);
        _voltageOfCurrent = new PiecewiseCubic(currentA, voltageV, slopeVPerA);
        HalfSpacingA = new double[n];
        for (int k = 0; k < n; k++)
        {
            double left = k > 0 ? currentA[k] - currentA[k - 1] : double.PositiveInfinity;
            double right = k + 1 < n ? currentA[k + 1] - currentA[k] : double.PositiveInfinity;
            HalfSpacingA[k] = 0.5 * Math.Min(left, right);
        }
    }

    /// <summary>Half the distance [A] from each node to its nearer neighbour (how close another node may come before one of them is redundant in a sum).</summary>
    public double[] HalfSpacingA { get; }

    /// <summary>Nodes in the table.</summary>
    public int NodeCount => _voltageOfCurrent.NodeCount;

    /// <summary>V(I) as a piecewise cubic (voltage [V] of current [A]).</summary>
    public PiecewiseCubic VoltageOfCurrent => _voltageOfCurrent;

    private readonly record struct Node(double DiodeVoltageV, double VoltageV, double CurrentA, double SlopeVPerA, double CellExponential);

    /// <summary>The model's constants in the form the node evaluation uses (reciprocals taken once).</summary>
    private readonly struct Constants(in SubstringModel model)
    {
        public readonly double PhotocurrentA = model.Cells.PhotocurrentA;
        public readonly double SaturationCurrentA = model.Cells.SaturationCurrentA;
        public readonly double InverseIdealityPerV = 1.0 / model.Cells.ModifiedIdealityV;
        public readonly double ShuntConductanceS = model.Cells.ShuntConductanceS;
        public readonly double SeriesResistanceOhm = model.Cells.SeriesResistanceOhm;
        public readonly double BypassSaturationCurrentA = model.BypassSaturationCurrentA;
        public readonly double InverseBypassIdealityPerV = 1.0 / model.BypassIdealityVoltageV;
    }

    /// <summary>The substring's operating point at cell diode voltage <paramref name="vd"/> [V], all explicit.</summary>
    private static Node Evaluate(in Constants p, double vd) => Evaluate(p, vd, PortableMath.Exp(Math.Min(vd * p.InverseIdealityPerV, 700.0)));

    /// <summary>
    /// The operating point halfway in diode voltage between two nodes: exp(Vd/a) there is the geometric mean of
    /// its values at the ends, exp((x + y)/2) = sqrt(exp(x) exp(y)), a square root instead of an exponential
    /// (both correctly rounded operations, so the result does not depend on the platform's exp).
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private static Node Midpoint(in Constants p, in Node a, in Node b)
    {
        double vd = 0.5 * (a.DiodeVoltageV + b.DiodeVoltageV);
        double product = a.CellExponential * b.CellExponential;
        return product < 1e300 ? Evaluate(p, vd, Math.Sqrt(product)) : Evaluate(p, vd);
    }

    /// <summary>The operating point at diode voltage <paramref name="vd"/> [V] with e = exp(Vd/a) given.</summary>
    private static Node Evaluate(in Constants p, double vd, double e)
    {
        double ic = p.PhotocurrentA - p.SaturationCurrentA * (e - 1.0) - p.ShuntConductanceS * vd;
        double dIcdVd = -p.SaturationCurrentA * p.InverseIdealityPerV * e - p.ShuntConductanceS;
        double v = vd - ic * p.SeriesResistanceOhm;
        double dVdVd = 1.0 - p.SeriesResistanceOhm * dIcdVd;
        // Above fifty n Vt the bypass diode's exponential is below 2e-22: it changes neither its current
        // (Is (e - 1) rounds to -Is) nor, in relative terms, the slope, so it is not computed.
        double x = -v * p.InverseBypassIdealityPerV;
        double eb = x < -50.0 ? 0.0 : PortableMath.Exp(Math.Min(x, 700.0));
        double ib = p.BypassSaturationCurrentA * (eb - 1.0);
        double bypassConductanceS = p.BypassSaturationCurrentA * p.InverseBypassIdealityPerV * eb;
        // dI/dV = dIc/dVd / (dV/dVd) - g_bypass, so dV/dI = (dV/dVd) / (dIc/dVd - g_bypass dV/dVd).
        return new Node(vd, v, ic + ib, dVdVd / (dIcdVd - bypassConductanceS * dVdVd), e);
    }

    /// <summary>The cubic Hermite through two nodes at current <paramref name="i"/>, in power form in t (the same cubic as <see cref="MonotoneHermite.Value"/>).</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private static double Hermite(in Node lo, in Node hi, double i)
    {
        double h = hi.CurrentA - lo.CurrentA;
        double t = (i - lo.CurrentA) / h;
        double a = h * lo.SlopeVPerA, b = h * hi.SlopeVPerA, dy = hi.VoltageV - lo.VoltageV;
        return lo.VoltageV + t * (a + t * (3 * dy - 2 * a - b + t * (a + b - 2 * dy)));
    }

    /// <summary>Substring voltage [V] at current [A] and dV/dI [V/A]; linear beyond the tabulated range.</summary>
    public double VoltageAtCurrent(double currentA, out double slopeVPerA) => _voltageOfCurrent.Evaluate(currentA, out slopeVPerA);
}
