namespace MpptArena.Numerics;

/// <summary>
/// A weighted sum of piecewise cubics, S(x) = sum of w_k f_k(x), and its slope, evaluated along ascending x at
/// a cost that does not grow with the number of terms. Between breakpoints S is one cubic, carried as its
/// Taylor coefficients about the current point and shifted forward by Horner's scheme; at a breakpoint of
/// one term only that term's second and third coefficients change, since a C1 piecewise cubic keeps its
/// value and slope across its nodes. The carried coefficients gather rounding, so a running bound on it
/// (each floating-point operation adds at most one unit roundoff of its operands: N. J. Higham, Accuracy
/// and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, sections 2.2 and 3.1) is propagated with
/// every shift, and every term is evaluated afresh at the current point before the bound on the value or the
/// slope could pass its budget. Short pieces are the danger: their divided differences amplify rounding by
/// 1/h^2 and 1/h^3, which the bound accounts for (<see cref="PiecewiseCubic.Taylor"/>).
/// </summary>
internal sealed class AscendingCubicSum
{
    private const double UnitRoundoff = 1.1102230246251565e-16; // 2^-53

    private readonly PiecewiseCubic[] _terms;
    private readonly double[] _weights;
    private readonly int[] _piece;
    private readonly Entry[] _entered; // each term's current piece: where the sweep entered it, and its coefficients there
    private readonly Breakpoint[] _heap; // each term's next breakpoint, a binary min-heap on the abscissa
    private int _heapCount;
    private readonly double _valueBudget, _slopeBudget;
    private double _x;
    private double _b0, _b1, _b2, _b3; // Taylor coefficients of S about _x
    private double _e0, _e1, _e2, _e3; // bounds on their error against a fresh evaluation

    /// <summary>Starts the sweep at <paramref name="startX"/> with a fresh evaluation of every term.</summary>
    /// <param name="terms">The piecewise cubics.</param>
    /// <param name="weights">Their weights.</param>
    /// <param name="startX">First abscissa of the sweep.</param>
    /// <param name="valueBudget">Largest allowed rounding of the carried value, in the units of f.</param>
    /// <param name="slopeBudget">Largest allowed rounding of the carried slope, in the units of f'.</param>
    public AscendingCubicSum(PiecewiseCubic[] terms, double[] weights, double startX, double valueBudget, double slopeBudget)
    {
        _terms = terms;
        _weights = weights;
        _valueBudget = valueBudget;
        _slopeBudget = slopeBudget;
        _piece = new int[terms.Length];
        _heap = new Breakpoint[terms.Length];
        _entered = new Entry[terms.Length];
        _x = startX;
        for (int k = 0; k < terms.Length; k++)
        {
            _piece[k] = terms[k].PieceAt(startX);
            double next = terms[k].PieceEnd(_piece[k]);
            if (!double.IsPositiveInfinity(next)) Push(new Breakpoint(next, k));
        }
        EvaluateAfresh();
    }

    /// <summary>Current abscissa.</summary>
    public double X => _x;

    /// <summary>S at the current abscissa.</summary>
    public double Value => _b0;

    /// <summary>dS/dx at the current abscissa.</summary>
    public double Slope => _b1;

    /// <summary>How many times every term was evaluated afresh (the start included).</summary>
    public int FreshEvaluations { get; private set; }

    /// <summary>The next breakpoint of any term ahead of the current abscissa; +infinity when none is left.</summary>
    public double NextBreakpoint => _heapCount > 0 ? _heap[0].X : double.PositiveInfinity;

    /// <summary>The piece of term <paramref name="term"/> that holds the current abscissa (numbered as by <see cref="PiecewiseCubic.PieceAt"/>).</summary>
    public int PieceOf(int term) => _piece[term];

    /// <summary>Moves to <paramref name="x"/>, which may not lie beyond <see cref="NextBreakpoint"/>.</summary>
    public void MoveTo(double x)
    {
        if (!(x >= _x) || x > NextBreakpoint) throw new ArgumentOutOfRangeException(nameof(x), "the sweep only moves forward and cannot pass a breakpoint");
        Advance(x);
    }

    /// <summary><see cref="MoveTo"/> for a point already known to lie between the current one and the next breakpoint.</summary>
    private void Advance(double x)
    {
        double d = x - _x;
        if (d == 0) return;
        double d2 = d * d, d3 = d2 * d;
        double e0 = _e0 + _e1 * d + _e2 * d2 + _e3 * d3
            + 8 * UnitRoundoff * (Math.Abs(_b0) + Math.Abs(_b1) * d + Math.Abs(_b2) * d2 + Math.Abs(_b3) * d3);
        double e1 = _e1 + 2 * _e2 * d + 3 * _e3 * d2
            + 8 * UnitRoundoff * (Math.Abs(_b1) + 2 * Math.Abs(_b2) * d + 3 * Math.Abs(_b3) * d2);
        _x = x;
        if (e0 > _valueBudget || e1 > _slopeBudget)
        {
            EvaluateAfresh();
            return;
        }
        _b0 += d * (_b1 + d * (_b2 + d * _b3));
        _b1 += d * (2 * _b2 + 3 * _b3 * d);
        _b2 += 3 * _b3 * d;
        _e0 = e0;
        _e1 = e1;
        _e2 += 3 * _e3 * d + 4 * UnitRoundoff * (Math.Abs(_b2) + 3 * Math.Abs(_b3) * d);
    }

    /// <summary>Moves to <see cref="NextBreakpoint"/> and continues on the next piece of its term; returns that term.</summary>
    public int CrossNextBreakpoint()
    {
        int k = _heap[0].Term;
        Advance(_heap[0].X);
        double w = _weights[k];
        // The piece being left, at its end: the second coefficient moves with the distance from where it
        // was entered (c2 + 3 c3 d), the third does not.
        ref Entry entered = ref _entered[k];
        double d = _x - entered.X;
        double oldC3 = entered.C3, oldScale3 = entered.Scale3;
        double oldC2 = entered.C2 + 3 * oldC3 * d;
        double oldScale2 = entered.Scale2 + 3 * oldScale3 * d;
        int piece = ++_piece[k];
        _terms[k].TaylorAtStart(piece, out double newC2, out double newC3, out double newScale2, out double newScale3);
        entered = new Entry(_x, newC2, newC3, newScale2, newScale3);
        _b2 += w * (newC2 - oldC2);
        _b3 += w * (newC3 - oldC3);
        _e2 += 8 * UnitRoundoff * (Math.Abs(w) * (oldScale2 + newScale2) + Math.Abs(_b2));
        _e3 += 8 * UnitRoundoff * (Math.Abs(w) * (oldScale3 + newScale3) + Math.Abs(_b3));
        double next = _terms[k].PieceEnd(piece);
        if (double.IsPositiveInfinity(next)) ReplaceTop(_heap[--_heapCount]); else ReplaceTop(new Breakpoint(next, k));
        return k;
    }

    private void EvaluateAfresh()
    {
        double b0 = 0, b1 = 0, b2 = 0, b3 = 0, s2 = 0, s3 = 0;
        for (int k = 0; k < _terms.Length; k++)
        {
            _terms[k].Taylor(_piece[k], _x, out double c0, out double c1, out double c2, out double c3, out double scale2, out double scale3);
            _entered[k] = new Entry(_x, c2, c3, scale2, scale3);
            double w = _weights[k];
            b0 += w * c0; b1 += w * c1; b2 += w * c2; b3 += w * c3;
            s2 += Math.Abs(w) * scale2; s3 += Math.Abs(w) * scale3;
        }
        _b0 = b0; _b1 = b1; _b2 = b2; _b3 = b3;
        // The value and slope are as good as a direct evaluation; the higher coefficients carry the
        // rounding of every term's divided differences.
        _e0 = _e1 = 0;
        _e2 = 8 * UnitRoundoff * s2;
        _e3 = 8 * UnitRoundoff * s3;
        FreshEvaluations++;
    }

    private readonly record struct Entry(double X, double C2, double C3, double Scale2, double Scale3);

    private readonly record struct Breakpoint(double X, int Term);

    private void Push(Breakpoint entry)
    {
        int i = _heapCount++;
        while (i > 0)
        {
            int parent = (i - 1) >> 1;
            if (_heap[parent].X <= entry.X) break;
            _heap[i] = _heap[parent];
            i = parent;
        }
        _heap[i] = entry;
    }

    /// <summary>Puts <paramref name="entry"/> in place of the smallest and sifts it down (the hole moves, not the entry).</summary>
    private void ReplaceTop(Breakpoint entry)
    {
        var heap = _heap;
        int count = _heapCount, i = 0;
        while (true)
        {
            int child = 2 * i + 1;
            if (child >= count) break;
            if (child + 1 < count && heap[child + 1].X < heap[child].X) child++;
            if (heap[child].X >= entry.X) break;
            heap[i] = heap[child];
            i = child;
        }
        if (count > 0) heap[i] = entry;
    }
}
