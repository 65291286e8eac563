namespace MpptArena.Numerics;

/// <summary>A scalar function that also returns its derivative; implemented by structs so that solvers inline it.</summary>
public interface IFunctionWithSlope
{
    /// <summary>f(x), with f'(x) in <paramref name="slope"/>.</summary>
    double Evaluate(double x, out double slope);
}
