namespace MpptArena.Procedure;

/// <summary>A weighted efficiency: the sum of weight times the static efficiency at each weighted power level.</summary>
/// <remarks>The weighting of the European and CEC inverter efficiencies, applied to MPPT efficiencies as in
/// EN 50530:2010 (from memory; see <see cref="ProcedureTable"/>).</remarks>
public static class WeightedEfficiency
{
    /// <summary>sum(w_k eta_k) [-]; null when a weighted level has no efficiency.</summary>
    /// <param name="weights">Power level [-] and weight [-] pairs.</param>
    /// <param name="efficiencyAt">Static efficiency at a power level [-], or null if it was not measured.</param>
    public static double? Of(IReadOnlyList<(double Level, double Weight)> weights, Func<double, double?> efficiencyAt)
    {
        double sum = 0;
        foreach (var (level, weight) in weights)
        {
            if (efficiencyAt(level) is not { } eta) return null;
            sum += weight * eta;
        }
        return sum;
    }
}
