using MpptArena.Pv;

namespace MpptArena.Tests.Pv;

public class SingleDiodeModelTests
{
    /// <summary>An ideal cell (n = 1, no Rs, no shunt) with normalised Voc = voc: a = 1 V, IL = 1 A.</summary>
    private static SingleDiodeParameters Ideal(double voc, double rs = 0, double gsh = 0) =>
        new(1.0, 1.0 / double.ExpM1(voc), 1.0, rs, gsh);

    private static double FillFactor(SingleDiodeParameters p)
    {
        var mpp = SingleDiodeModel.MaximumPowerPoint(p);
        return mpp.PowerW / (SingleDiodeModel.OpenCircuitVoltageV(p) * SingleDiodeModel.ShortCircuitCurrentA(p));
    }

    private static double GreenIdeal(double voc) => (voc - Math.Log(voc + 0.72)) / (voc + 1.0);

    [Theory]
    [InlineData(12.0)]
    [InlineData(20.0)]
    [InlineData(30.0)]
    public void IdealFillFactorMatchesGreensEmpiricalFormula(double voc)
    {
        // Source: M. A. Green, "Solar cell fill factors: general graph and empirical expressions",
        // Solid-State Electronics 24 (1981) 788-789: FF0 = (voc - ln(voc + 0.72))/(voc + 1), accurate to
        // about 1e-4 for voc > 10.
        Assert.Equal(GreenIdeal(voc), FillFactor(Ideal(voc)), 1.5e-4);
    }

    [Fact]
    public void IdealFillFactorAtVoc20MatchesExactValue()
    {
        // Derived (REFERENCES.md): vmp = W(e^(voc+1)) - 1 gives FF = 0.8079555 at voc = 20.
        Assert.Equal(0.8079555, FillFactor(Ideal(20.0)), 1e-7);
        Assert.Equal(0.8079555, DeSotoDatasheetFit.IdealFillFactor(20.0), 1e-7);
    }

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.1)]
    [InlineData(0.2)]
    public void SeriesResistanceLowersFillFactorAsGreenPredicts(double rsNormalised)
    {
        // Source: Green (1981): FFs = FF0 (1 - 1.1 rs) + rs^2/5.4 for rs < 0.4, voc > 10, rs = Rs/(Voc/Isc).
        // Green quotes a few-percent accuracy (from memory); 1.5 % relative is the tolerance used here.
        const double voc = 20.0;
        double ff0 = GreenIdeal(voc);
        double expected = ff0 * (1 - 1.1 * rsNormalised) + rsNormalised * rsNormalised / 5.4;
        double actual = FillFactor(Ideal(voc, rs: rsNormalised * voc / 1.0));
        Assert.True(Math.Abs(actual - expected) / expected < 0.015, $"model {actual:F5}, Green {expected:F5}");
        Assert.True(actual < FillFactor(Ideal(voc)));
    }

    [Theory]
    [InlineData(5.0)]
    [InlineData(20.0)]
    public void ShuntResistanceLowersFillFactorAsGreenPredicts(double rshNormalised)
    {
        // Source: Green (1981): FFsh = FF0 {1 - [(voc + 0.7)/voc] FF0/rsh} for rsh > 0.4, rsh = Rsh/(Voc/Isc).
        const double voc = 20.0;
        double ff0 = GreenIdeal(voc);
        double expected = ff0 * (1 - (voc + 0.7) / voc * ff0 / rshNormalised);
        double actual = FillFactor(Ideal(voc, gsh: 1.0 / (rshNormalised * voc)));
        Assert.True(Math.Abs(actual - expected) / expected < 0.01, $"model {actual:F5}, Green {expected:F5}");
    }

    [Fact]
    public void CurrentAndVoltageSolutionsInvertEachOther()
    {
        // Identity of the two Lambert W solutions (Jain & Kapoor 2004, eqs. 4-5): V(I(V)) = V.
        var p = ReferenceModules.Fitted60.Reference;
        double voc = SingleDiodeModel.OpenCircuitVoltageV(p);
        for (double v = -voc; v <= 1.2 * voc; v += voc / 97)
        {
            double i = SingleDiodeModel.CurrentAtVoltage(p, v);
            double back = SingleDiodeModel.VoltageAtCurrent(p, i);
            Assert.True(Math.Abs(back - v) <= 1e-8 * voc, $"V = {v}: I = {i}, back {back}");
        }
    }

    [Fact]
    public void EquationResidualIsZeroOnTheCurve()
    {
        // Definition of the model (De Soto et al. 2006, eq. 1), evaluated directly where exp is safe.
        var p = ReferenceModules.Fitted60.Reference;
        for (double v = 0; v <= 40; v += 0.5)
        {
            double i = SingleDiodeModel.CurrentAtVoltage(p, v);
            double vd = v + i * p.SeriesResistanceOhm;
            double residual = p.PhotocurrentA - p.SaturationCurrentA * double.ExpM1(vd / p.ModifiedIdealityV) - vd * p.ShuntConductanceS - i;
            Assert.True(Math.Abs(residual) < 1e-9, $"V = {v}: residual {residual}");
        }
    }

    [Fact]
    public void NothingOverflowsFromDeepReverseBiasTo120PercentVocAtAnyIrradianceAndTemperature()
    {
        var module = ReferenceModules.Fitted60;
        foreach (double g in new[] { 0.0, 1e-6, 1.0, 200.0, 1000.0, 1500.0 })
        foreach (double t in new[] { -40.0, 25.0, 85.0 })
        {
            var p = module.At(g, t);
            double vocStc = 38.2;
            for (double v = -1.5 * vocStc; v <= 1.2 * vocStc * 1.3; v += 0.37)
            {
                double i = SingleDiodeModel.CurrentAtVoltage(p, v);
                Assert.True(double.IsFinite(i), $"G {g}, T {t}, V {v}: I = {i}");
            }
            for (double i = -20; i <= p.PhotocurrentA; i += 0.25)
            {
                double v = SingleDiodeModel.VoltageAtCurrent(p, i);
                Assert.True(double.IsFinite(v), $"G {g}, T {t}, I {i}: V = {v}");
            }
        }
    }

    [Fact]
    public void MaximumPowerPointMatchesA50DigitSolutionTo1e12()
    {
        // Reference: the single-diode equation I = IL - I0 (exp((V + I Rs)/a) - 1) - (V + I Rs)/Rsh and
        // dP/dV = 0 solved at 50 significant digits with mpmath 1.3 (F. Johansson et al., mpmath: a Python
        // library for arbitrary-precision floating-point arithmetic, 2023; findroot and diff) for
        // IL 9.5 A, I0 1.2e-10 A, a 1.55 V, Rs 0.35 Ohm, Rsh 350 Ohm:
        // Vmp = 31.1756826463662680659288769883 V, Imp = 8.91397057876026453133378280915 A,
        // Pmp = 277.899117882475857907501370291 W, Voc = 38.8787420978415672461696908067 V.
        var p = SingleDiodeParameters.FromShuntResistance(9.5, 1.2e-10, 1.55, 0.35, 350);
        var (vmp, imp, pmp) = SingleDiodeModel.MaximumPowerPoint(p);
        Assert.Equal(31.1756826463662680659288769883, vmp, 1e-12 * 31.18);
        Assert.Equal(8.91397057876026453133378280915, imp, 1e-12 * 8.914);
        Assert.Equal(277.899117882475857907501370291, pmp, 1e-13 * 277.9);
        Assert.Equal(38.8787420978415672461696908067, SingleDiodeModel.OpenCircuitVoltageV(p), 1e-12 * 38.88);
    }
}
