using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace MpptArena.Sweeps;

/// <summary>
/// Derivative-free minimisation within box bounds: the Nelder-Mead simplex of MathNet.Numerics on
/// coordinates scaled to [0, 1]; points outside the box are projected onto it and pay a quadratic
/// penalty, so the search stays inside the declared parameter ranges.
/// </summary>
/// <remarks>J. A. Nelder, R. Mead, "A simplex method for function minimization", The Computer Journal
/// 7(4), 1965, 308-313.</remarks>
public static class ParameterTuner
{
    /// <summary>One evaluation of the objective.</summary>
    /// <param name="Values">Parameter values.</param>
    /// <param name="Objective">Objective value (minimised).</param>
    public sealed record Evaluation(IReadOnlyList<double> Values, double Objective);

    /// <summary>Minimises <paramref name="objective"/> over the box [min, max] starting from <paramref name="start"/>.</summary>
    /// <returns>The best point and every evaluation in order.</returns>
    public static (IReadOnlyList<double> Best, double BestObjective, IReadOnlyList<Evaluation> History) Minimise(
        Func<IReadOnlyList<double>, double> objective, IReadOnlyList<double> min, IReadOnlyList<double> max, IReadOnlyList<double> start, int maxEvaluations, double tolerance = 1e-6)
    {
        int n = start.Count;
        var history = new List<Evaluation>();
        var cache = new Dictionary<string, double>();
        double[] ToValues(Vector<double> u)
        {
            var x = new double[n];
            for (int k = 0; k < n; k++) x[k] = min[k] + Math.Clamp(u[k], 0, 1) * (max[k] - min[k]);
            return x;
        }
        double Scaled(Vector<double> u)
        {
            var x = ToValues(u);
            double penalty = 0;
            for (int k = 0; k < n; k++) { double outside = Math.Max(0, -u[k]) + Math.Max(0, u[k] - 1); penalty += outside * outside; }
            string key = string.Join(",", x.Select(v => v.ToString("R", System.Globalization.CultureInfo.InvariantCulture)));
            if (!cache.TryGetValue(key, out double f))
            {
                if (history.Count >= maxEvaluations) return history.Min(h => h.Objective) + 1 + penalty; // budget spent: stop improving
                f = objective(x);
                cache[key] = f;
                history.Add(new Evaluation(x, f));
            }
            return f + 1e3 * penalty;
        }
        var u0 = Vector<double>.Build.Dense(n, k => (start[k] - min[k]) / (max[k] - min[k]));
        var step = Vector<double>.Build.Dense(n, 0.15);
        try
        {
            new NelderMeadSimplex(tolerance, Math.Max(maxEvaluations, 10)).FindMinimum(ObjectiveFunction.Value(Scaled), u0, step);
        }
        catch (MaximumIterationsException)
        {
            // The evaluation budget ends the search; the best point so far is the answer.
        }
        var best = history.OrderBy(h => h.Objective).First();
        return (best.Values, best.Objective, history);
    }
}
