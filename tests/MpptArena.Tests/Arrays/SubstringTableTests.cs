using MpptArena.Arrays;

namespace MpptArena.Tests.Arrays;

public class SubstringTableTests
{
    [Theory]
    [InlineData(1000.0, 25.0)]
    [InlineData(150.0, 60.0)]
    [InlineData(1400.0, -30.0)]
    [InlineData(3.0, 10.0)]
    [InlineData(0.0, 40.0)]
    public void TableFromTheDiodeVoltageMatchesTheNewtonSolveEverywhere(double irradianceWm2, double temperatureC)
    {
        // The table is built along the diode voltage Vd = V + I Rs, where the single-diode equation
        // (De Soto, Klein, Beckman, Solar Energy 80, 2006, eq. 1) and the bypass diode are explicit; it
        // must reproduce the terminal voltage that the safeguarded Newton solve of the same equations
        // gives, over the whole current range including the bypass region and the reverse range.
        var array = ReferenceModules.Array(1, 1);
        var conditions = array.UniformConditions(irradianceWm2, temperatureC);
        var substring = array.Solve(conditions).Strings[0].DistinctSubstrings[0];
        double isc = Math.Max(substring.ShortCircuitCurrentA, 1e-3);
        double low = -5 * isc, high = 1.02 * isc + 1e-3, tolerance = PreparedArrayCurve.SubstringVoltageToleranceV;
        var table = new SubstringTable(substring, low, high, tolerance);
        double worst = 0;
        for (int k = 0; k <= 2000; k++)
        {
            double i = low + (high - low) * k / 2000;
            double tabulated = table.VoltageAtCurrent(i, out _);
            double exact = substring.VoltageAtCurrent(i, out _);
            worst = Math.Max(worst, Math.Abs(tabulated - exact) / tolerance);
        }
        // The refinement checks midpoints with a margin; the tolerance must hold everywhere.
        Assert.True(worst <= 1, $"worst error {worst:F4} times the tolerance");
    }

    [Fact]
    public void StringNodesCarryTheSumOfTheirSubstringVoltages()
    {
        // Kirchhoff's voltage law: substrings in series carry one current and the string voltage is the sum
        // of theirs. The string curve's sweep carries that sum as a running cubic instead of summing the 30
        // tables at every node; at every node it must still equal the direct sum of the same tables (up to the
        // rounding budget the sweep keeps, a tenth of the table tolerance; in practice about 1e-11 V).
        var array = ReferenceModules.Array(10, 1);
        var c = ReferenceModules.RandomShading(array, 40, seed: 7);
        var model = array.Solve(c).Strings[0];
        double isc = model.MaxShortCircuitCurrentA, low = -5 * isc, high = 1.02 * isc + 1e-3;
        double tolerance = PreparedArrayCurve.SubstringVoltageToleranceV;
        var curve = new PreparedStringCurve(model, low, high, tolerance);
        var tables = model.DistinctSubstrings.Select(s => new SubstringTable(s, low, high, tolerance)).ToArray();
        Assert.Equal(30, tables.Length);
        var cubic = curve.ToCubic();
        double worst = 0;
        foreach (double v in curve.NodeVoltagesV)
        {
            double i = cubic.Evaluate(v);
            double sum = 0;
            for (int k = 0; k < tables.Length; k++) sum += model.Counts[k] * tables[k].VoltageAtCurrent(i, out _);
            worst = Math.Max(worst, Math.Abs(sum - v));
        }
        Assert.True(worst < 1e-9, $"worst difference {worst:E2} V");
        Assert.True(curve.FreshEvaluations < curve.NodeCount / 10, $"{curve.FreshEvaluations} fresh evaluations for {curve.NodeCount} nodes");
    }
}
