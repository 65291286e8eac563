namespace MpptArena.Numerics;

/// <summary>
/// A C1 piecewise-cubic function stored for fast evaluation: per interval the Hermite data
/// (y0, y1, h m0, h m1, 1/h), and a uniform bucket index over x so that finding the interval costs a
/// multiplication and, on average, less than one comparison instead of a binary search (a bisection
/// only within a bucket that holds many nodes). Outside the
/// node range it continues linearly with the end slopes.
/// </summary>
/// <remarks>Cubic Hermite form as in Fritsch and Carlson, SIAM J. Numer. Anal. 17(2), 1980.</remarks>
public sealed class PiecewiseCubic
{
    private readonly double[] _x, _y0, _y1, _m0h, _m1h, _invH;
    private readonly int[] _bucketStart;
    private readonly double _bucketScale, _xFirst, _xLast, _yFirst, _yLast, _slopeFirst, _slopeLast;

    /// <summary>Builds the function from nodes with values and slopes; x strictly increasing.</summary>
    public PiecewiseCubic(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> slope)
    {
        int n = x.Length;
        if (n < 2) throw new ArgumentException("a piecewise cubic needs two or more nodes");
        _x = x.ToArray();
        _y0 = new double[n - 1]; _y1 = new double[n - 1]; _m0h = new double[n - 1]; _m1h = new double[n - 1]; _invH = new double[n - 1];
        for (int k = 0; k < n - 1; k++)
        {
            double h = x[k + 1] - x[k];
            _y0[k] = y[k]; _y1[k] = y[k + 1]; _m0h[k] = slope[k] * h; _m1h[k] = slope[k + 1] * h; _invH[k] = 1.0 / h;
        }
        _xFirst = x[0]; _xLast = x[n - 1]; _yFirst = y[0]; _yLast = y[n - 1]; _slopeFirst = slope[0]; _slopeLast = slope[n - 1];
        int buckets = 2 * n;
        _bucketScale = buckets / (_xLast - _xFirst);
        _bucketStart = new int[buckets + 1];
        int j = 0;
        for (int b = 0; b <= buckets; b++)
        {
            double edge = _xFirst + b / _bucketScale;
            while (j < n - 2 && _x[j + 1] <= edge) j++;
            _bucketStart[b] = j;
        }
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
        int bucket = Math.Min((int)((x - _xFirst) * _bucketScale), _bucketStart.Length - 2);
        int j = _bucketStart[bucket];
        var xs = _x;
        int last = _bucketStart[bucket + 1];
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

    /// <summary>
    /// f(x) and f'(x) for a sweep in ascending x: <paramref name="interval"/> carries the interval of the
    /// previous call (start at 0) and only walks forward, so a sorted sweep costs no search.
    /// </summary>
    public double EvaluateAscending(double x, ref int interval, out double slope)
    {
        if (x <= _xFirst || x >= _xLast) return Linear(x, out slope);
        int j = interval;
        var xs = _x;
        while (x > xs[j + 1]) j++;
        interval = j;
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
        double invH = _invH[j];
        double t = (x - _x[j]) * invH;
        double y0 = _y0[j], y1 = _y1[j], a = _m0h[j], b = _m1h[j];
        double t2 = t * t, t3 = t2 * t;
        slope = ((6 * t2 - 6 * t) * (y0 - y1) + (3 * t2 - 4 * t + 1) * a + (3 * t2 - 2 * t) * b) * invH;
        return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * a + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * b;
    }

    /// <summary>f(x).</summary>
    public double Evaluate(double x) => Evaluate(x, out _);
}
