namespace MpptArena.Numerics;

/// <summary>
/// A running sum that carries its own rounding error, so that a run's energy (hundreds of thousands of small
/// terms) is exact to about one rounding of the total, and a small difference of two such sums (the energy
/// lost) keeps its digits.
/// </summary>
/// <remarks>Neumaier's improvement of Kahan summation: A. Neumaier, "Rundungsfehleranalyse einiger Verfahren
/// zur Summation endlicher Summen", ZAMM 54 (1974) 39-51. Plain IEEE additions only, so the same bits everywhere.</remarks>
public struct CompensatedSum
{
    private double _sum, _compensation;

    /// <summary>Adds <paramref name="x"/>.</summary>
    public void Add(double x)
    {
        double t = _sum + x;
        _compensation += Math.Abs(_sum) >= Math.Abs(x) ? (_sum - t) + x : (x - t) + _sum;
        _sum = t;
    }

    /// <summary>The sum so far.</summary>
    public readonly double Value => _sum + _compensation;
}
