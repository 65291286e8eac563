namespace MpptArena.Numerics;

/// <summary>
/// A C1 piecewise-cubic function stored for fast evaluation: per interval the Hermite data
/// (x0, y0, y1, h m0, h m1, 1/h) side by side in one record (an evaluation reads one or two cache lines), and a uniform bucket index over x (built on first use) so that finding the interval costs a
/// multiplication and, on average, less than one comparison instead of a binary search (a bisection
/// only within a bucket that holds many nodes). Outside the
/// node range it continues linearly with the end slopes.
/// </summary>
/// <remarks>Cubic Hermite form as in Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980.</remarks>
public sealed class PiecewiseCubic
{
    private readonly double[] _x;
    private readonly Piece[] _pieces;
    private int[]? _bucketStart;
    private readonly double _bucketScale, _xFirst, _xLast, _yFirst, _yLast, _slopeFirst, _slopeLast;

    /// <summary>Builds the function from nodes with values and slopes; x strictly increasing.</summary>
    public PiecewiseCubic(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> slope)
    {
        int n = x.Length;
        if (n < 2) throw new ArgumentException("a piecewise cubic needs two or more nodes");
        _x = x.ToArray();
        _pieces = new Piece[n - 1];
        for (int k = 0; k < n - 1; k++)
        {
            double h = x[k + 1] - x[k];
            _pieces[k] = new Piece(x[k], y[k], y[k + 1], slope[k] * h, slope[k + 1] * h, 1.0 / h);
        }
        _xFirst = x[0]; _xLast = x[n - 1]; _yFirst = y[0]; _yLast = y[n - 1]; _slopeFirst = slope[0]; _slopeLast = slope[n - 1];
        _bucketScale = 2 * n / (_xLast - _xFirst);
    }

    /// <summary>
    /// The bucket index, built on the first random-access evaluation (a curve that is only swept never
    /// needs it). Two threads may both build it; they build the same array, and either is kept whole.
    /// </summary>
    private int[] BuildBuckets()
    {
        int n = _x.Length;
        int buckets = 2 * n;
        var bucketStart = new int[buckets + 1];
        int j = 0;
        double bucketWidth = (_xLast - _xFirst) / buckets;
        for (int b = 0; b <= buckets; b++)
        {
            double edge = _xFirst + b * bucketWidth;
            while (j < n - 2 && _x[j + 1] <= edge) j++;
            bucketStart[b] = j;
        }
        Volatile.Write(ref _bucketStart, bucketStart); // published whole
        return bucketStart;
    }

    /// <summary>Number of nodes.</summary>
    public int NodeCount => _x.Length;

    /// <summary>Node abscissae.</summary>
    public ReadOnlySpan<double> Nodes => _x;

    /// <summary>Lowest node.</summary>
    public double First => _xFirst;

    /// <summary>Highest node.</summary>
    public double Last => _xLast;

    /// <summary>f(x) and f'(x).</summary>
    public double Evaluate(double x, out double slope)
    {
        if (x <= _xFirst || x >= _xLast) return Linear(x, out slope);
        var bucketStart = _bucketStart ?? BuildBuckets();
        int bucket = Math.Min((int)((x - _xFirst) * _bucketScale), bucketStart.Length - 2);
        int j = bucketStart[bucket];
        var xs = _x;
        int last = bucketStart[bucket + 1];
        if (last - j > 8)
        {
            // A crowded bucket (nodes cluster at knees): bisect among its intervals instead of walking.
            int lo = j, hi = last;
            while (lo < hi)
            {
                int mid = (lo + hi + 1) >> 1;
                if (xs[mid] < x) lo = mid; else hi = mid - 1;
            }
            j = lo;
        }
        while (x > xs[j + 1]) j++;
        return Hermite(j, x, out slope);
    }

    /// <summary>The linear continuation beyond the first or last node.</summary>
    private double Linear(double x, out double slope)
    {
        if (x <= _xFirst)
        {
            slope = _slopeFirst;
            return _yFirst + _slopeFirst * (x - _xFirst);
        }
        slope = _slopeLast;
        return _yLast + _slopeLast * (x - _xLast);
    }

    private double Hermite(int j, double x, out double slope)
    {
        ref readonly var p = ref _pieces[j];
        double invH = p.InvH;
        double t = (x - p.X0) * invH;
        double y0 = p.Y0, y1 = p.Y1, a = p.M0H, b = p.M1H;
        double t2 = t * t, t3 = t2 * t;
        slope = ((6 * t2 - 6 * t) * (y0 - y1) + (3 * t2 - 4 * t + 1) * a + (3 * t2 - 2 * t) * b) * invH;
        return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * a + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * b;
    }

    /// <summary>f(x).</summary>
    public double Evaluate(double x) => Evaluate(x, out _);

    /// <summary>
    /// Every critical point of g(x) = x f(x) on [<paramref name="from"/>, <paramref name="to"/>] inside the node
    /// range, in rising x, each marked as a maximum (g' turns from positive to negative) or a minimum. On each
    /// interval g is a quartic, so g' is a cubic; the roots of g'' (a quadratic, in closed form) split the
    /// interval into pieces on which g' is monotone and changes sign at most once, and each sign change is
    /// bisected to neighbouring doubles. No critical point can be stepped over, however narrow its hill.
    /// </summary>
    public List<(double X, bool IsMaximum)> CriticalPointsOfXTimes(double from, double to)
    {
        var result = new List<(double X, bool IsMaximum)>();
        from = Math.Max(from, _xFirst);
        to = Math.Min(to, _xLast);
        if (!(to > from)) return result;
        int previousSign = 0;
        Span<double> cuts = stackalloc double[4];
        for (int j = 0; j < _pieces.Length; j++)
        {
            ref readonly var p = ref _pieces[j];
            double h = 1.0 / p.InvH, x1 = p.X0 + h;
            if (x1 <= from) continue;
            if (p.X0 >= to) break;
            // f(t) = c0 + c1 t + c2 t^2 + c3 t^3 with x = X0 + h t; g(t) = (X0 + h t) f(t) = sum q_k t^k.
            double c0 = p.Y0, c1 = p.M0H, c2 = -3 * p.Y0 + 3 * p.Y1 - 2 * p.M0H - p.M1H, c3 = 2 * p.Y0 - 2 * p.Y1 + p.M0H + p.M1H;
            double q1 = p.X0 * c1 + h * c0, q2 = p.X0 * c2 + h * c1, q3 = p.X0 * c3 + h * c2, q4 = h * c3;
            // dg/dt = q1 + 2 q2 t + 3 q3 t^2 + 4 q4 t^3 (same sign as dg/dx, h > 0); its derivative 2 q2 + 6 q3 t + 12 q4 t^2.
            double tFrom = Math.Max(0.0, (from - p.X0) * p.InvH), tTo = Math.Min(1.0, (to - p.X0) * p.InvH);
            int n = 0;
            cuts[n++] = tFrom;
            foreach (double r in QuadraticRoots(12 * q4, 6 * q3, 2 * q2))
            {
                if (r > tFrom && r < tTo) cuts[n++] = r;
            }
            if (n == 3 && cuts[2] < cuts[1]) (cuts[1], cuts[2]) = (cuts[2], cuts[1]);
            cuts[n++] = tTo;
            double Slope(double t) => q1 + t * (2 * q2 + t * (3 * q3 + t * 4 * q4));
            for (int k = 0; k < n; k++)
            {
                double t = cuts[k];
                int sign = Slope(t) > 0 ? 1 : -1;
                if (previousSign != 0 && sign != previousSign)
                {
                    // The sign changed between the previous cut and this one, where g' is monotone.
                    double lo = k > 0 ? cuts[k - 1] : 0.0, hi = t;
                    bool rising = previousSign > 0;
                    double root = Bisection.FindSignChange(u => Slope(u) > 0 == rising, lo, hi);
                    result.Add((p.X0 + h * root, rising));
                }
                previousSign = sign;
            }
        }
        return result;
    }

    /// <summary>Real roots of a t^2 + b t + c (a may be zero), by the cancellation-free form of the quadratic formula.</summary>
    private static IEnumerable<double> QuadraticRoots(double a, double b, double c)
    {
        if (a == 0)
        {
            if (b != 0) yield return -c / b;
            yield break;
        }
        double disc = b * b - 4 * a * c;
        if (disc < 0) yield break;
        double q = -0.5 * (b + Math.CopySign(Math.Sqrt(disc), b));
        if (q != 0)
        {
            yield return q / a;
            yield return c / q;
        }
        else
        {
            yield return 0.0;
        }
    }

    /// <summary>f(x) by a binary search for its interval, without building the bucket index (for a one-off evaluation).</summary>
    internal double EvaluateOnce(double x)
    {
        if (x <= _xFirst || x >= _xLast) return Linear(x, out _);
        return Hermite(PieceAt(x), x, out _);
    }

    /// <summary>
    /// The piece that holds <paramref name="x"/> from the right: -1 before the first node (the linear
    /// continuation), k for x in [x_k, x_k+1), NodeCount - 1 from the last node on.
    /// </summary>
    internal int PieceAt(double x)
    {
        if (x < _xFirst) return -1;
        if (x >= _xLast) return _x.Length - 1;
        int lo = 0, hi = _x.Length - 2;
        while (lo < hi)
        {
            int mid = (lo + hi + 1) >> 1;
            if (_x[mid] <= x) lo = mid; else hi = mid - 1;
        }
        return lo;
    }

    /// <summary>The node at which <paramref name="piece"/> (as numbered by <see cref="PieceAt"/>) ends; +infinity for the last.</summary>
    internal double PieceEnd(int piece) => piece + 1 < _x.Length ? _x[piece + 1] : double.PositiveInfinity;

    /// <summary>The second and third Taylor coefficients of an interior piece about its first node, with their bounds (see <see cref="Taylor"/>).</summary>
    internal void TaylorAtStart(int piece, out double c2, out double c3, out double scale2, out double scale3)
    {
        if (piece < 0 || piece >= _pieces.Length)
        {
            c2 = c3 = scale2 = scale3 = 0;
            return;
        }
        ref readonly var p = ref _pieces[piece];
        double invH = p.InvH, y0 = p.Y0, y1 = p.Y1, a = p.M0H, b = p.M1H;
        double invH2 = invH * invH, dy = y1 - y0;
        c2 = (3 * dy - 2 * a - b) * invH2;
        c3 = (a + b - 2 * dy) * invH2 * invH;
        double size = Math.Abs(y0) + Math.Abs(y1);
        scale3 = (2 * size + Math.Abs(a) + Math.Abs(b)) * invH2 * invH;
        scale2 = (3 * size + 2 * Math.Abs(a) + Math.Abs(b)) * invH2;
    }

    /// <summary>
    /// Taylor coefficients of one piece about <paramref name="x"/>: f(x + d) = c0 + c1 d + c2 d^2 + c3 d^3,
    /// and bounds <paramref name="scale2"/>, <paramref name="scale3"/> on |c2| and |c3| that also bound
    /// their rounding in units of the machine epsilon (the divided differences of a short piece amplify
    /// the rounding of its values and slopes by 1/h^2 and 1/h^3).
    /// </summary>
    internal void Taylor(int piece, double x, out double c0, out double c1, out double c2, out double c3, out double scale2, out double scale3)
    {
        if (piece < 0 || piece >= _pieces.Length)
        {
            c1 = piece < 0 ? _slopeFirst : _slopeLast;
            c0 = piece < 0 ? _yFirst + _slopeFirst * (x - _xFirst) : _yLast + _slopeLast * (x - _xLast);
            c2 = c3 = scale2 = scale3 = 0;
            return;
        }
        // About the left node: y0 + (a/h) d + p2 d^2 + p3 d^3, shifted to x = x_k + d.
        TaylorAtStart(piece, out double p2, out double p3, out double scale2AtStart, out scale3);
        ref readonly var p = ref _pieces[piece];
        double p1 = p.M0H * p.InvH;
        double d = x - p.X0;
        c3 = p3;
        c2 = p2 + 3 * p3 * d;
        c1 = p1 + (2 * p2 + 3 * p3 * d) * d;
        c0 = p.Y0 + (p1 + (p2 + p3 * d) * d) * d;
        scale2 = scale2AtStart + 3 * scale3 * Math.Abs(d);
    }

    /// <summary>One interval's Hermite data: left node x0, end values y0 and y1, end slopes times the width, 1/width.</summary>
    private readonly record struct Piece(double X0, double Y0, double Y1, double M0H, double M1H, double InvH);
}
