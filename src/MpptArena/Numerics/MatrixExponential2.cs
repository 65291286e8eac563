namespace MpptArena.Numerics;

/// <summary>
/// The exponential exp(A t) of a real 2 x 2 matrix A = [[a, b], [c, d]] in closed form.
/// </summary>
/// <remarks>
/// By the Cayley-Hamilton theorem exp(A t) = exp(mu t) [f0(t) I + f1(t) (A - mu I)] with mu = (a + d)/2 and
/// delta^2 = ((a - d)/2)^2 + b c: f0 = cosh(delta t), f1 = sinh(delta t)/delta for delta^2 &gt; 0, and
/// cos / sin for delta^2 &lt; 0 (C. Moler, C. Van Loan, "Nineteen dubious ways to compute the exponential
/// of a matrix", SIAM Review 20(4), 1978, method 15; D. S. Bernstein, W. So, "Some explicit formulas for
/// the matrix exponential", IEEE Trans. Automatic Control 38(8), 1993, 1228-1232). The hyperbolic case is
/// evaluated as a sum of the two eigen-exponentials, so a stiff matrix (eigenvalues far apart) neither
/// overflows nor cancels; near a double eigenvalue sinh(x)/x is taken from its series.
/// </remarks>
public readonly record struct MatrixExponential2(double A11, double A12, double A21, double A22)
{
    /// <summary>exp(A t) for A = [[a11, a12], [a21, a22]] and time <paramref name="t"/> [any unit consistent with A].</summary>
    public static MatrixExponential2 Of(double a11, double a12, double a21, double a22, double t)
    {
        double mu = 0.5 * (a11 + a22);
        double half = 0.5 * (a11 - a22);
        double delta2 = half * half + a12 * a21;
        double f0, f1; // exp(mu t) f0(t), exp(mu t) f1(t)
        if (delta2 >= 0)
        {
            double delta = Math.Sqrt(delta2);
            double z = delta * t;
            if (z < 0.5)
            {
                double e = PortableMath.Exp(mu * t), z2 = z * z;
                f0 = e * PortableMath.Cosh(z);
                f1 = e * t * (1 + z2 / 6 * (1 + z2 / 20 * (1 + z2 / 42 * (1 + z2 / 72))));
            }
            else
            {
                double ePlus = PortableMath.Exp((mu + delta) * t), eMinus = PortableMath.Exp((mu - delta) * t);
                f0 = 0.5 * (ePlus + eMinus);
                f1 = 0.5 * (ePlus - eMinus) / delta;
            }
        }
        else
        {
            double omega = Math.Sqrt(-delta2);
            double e = PortableMath.Exp(mu * t);
            f0 = e * PortableMath.Cos(omega * t);
            f1 = e * PortableMath.Sin(omega * t) / omega;
        }
        return new MatrixExponential2(f0 + f1 * half, f1 * a12, f1 * a21, f0 - f1 * half);
    }

    /// <summary>The product with a column vector (x, y).</summary>
    public (double X, double Y) Times(double x, double y) => (A11 * x + A12 * y, A21 * x + A22 * y);
}
