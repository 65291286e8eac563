using FsCheck;
using FsCheck.Fluent;
using MpptArena.Arrays;

namespace MpptArena.Tests.Arrays;

public class CurvePropertyTests
{
    /// <summary>A random 1 x 4 array state: each substring's irradiance in [0, 1500] W/m2, one temperature in [-40, 85] degC.</summary>
    private static Arbitrary<(double[] Irradiance, double Temperature)> States() =>
        (from g in Gen.ArrayOf(Gen.Choose(0, 1500), 12)
         from t in Gen.Choose(-40, 85)
         select (g.Select(x => (double)x).ToArray(), (double)t)).ToArbitrary();

    private static (ExactArrayCurve Exact, PreparedArrayCurve Prepared) Curves((double[] Irradiance, double Temperature) s)
    {
        var array = ReferenceModules.Array(4, 1);
        var c = array.UniformConditions(0, s.Temperature);
        s.Irradiance.CopyTo(c.IrradianceWm2, 0);
        var exact = array.Solve(c);
        return (exact, new PreparedArrayCurve(exact));
    }

    [Fact]
    public void ArrayCurrentNeverRisesWithVoltageAndHasNoJumps()
    {
        // Kirchhoff and the diode equations make I(V) non-increasing and continuous for any shading
        // (common practice; the property the issue asks to check over random conditions).
        Prop.ForAll(States(), s =>
        {
            var (exact, prepared) = Curves(s);
            double voc = Math.Max(exact.OpenCircuitVoltageV, 1.0);
            double previous = prepared.CurrentAtVoltage(0);
            double isc = Math.Max(previous, 1e-3);
            for (int i = 1; i <= 400; i++)
            {
                double now = prepared.CurrentAtVoltage(voc * i / 400);
                if (!double.IsFinite(now) || now > previous + 1e-9 || previous - now > 0.2 * isc) return false;
                previous = now;
            }
            return true;
        }).Check(Config.QuickThrowOnFailure.WithMaxTest(50));
    }

    [Fact]
    public void PreparedCurveMatchesTheExactSolveForRandomShading()
    {
        // Requirement: prepared power within 1e-4 of the MPP power of the exact solve, for any state.
        Prop.ForAll(States(), s =>
        {
            var (exact, prepared) = Curves(s);
            double voc = exact.OpenCircuitVoltageV;
            if (voc <= 0) return true;
            double pmpp = MppSearch.FindPeaks(exact, 400).Global.PowerW;
            if (pmpp <= 1e-6) return true;
            for (int i = 0; i <= 60; i++)
            {
                double v = voc * i / 60;
                if (Math.Abs(v * (prepared.CurrentAtVoltage(v) - exact.CurrentAtVoltage(v))) > 1e-4 * pmpp) return false;
            }
            return true;
        }).Check(Config.QuickThrowOnFailure.WithMaxTest(25));
    }
}
