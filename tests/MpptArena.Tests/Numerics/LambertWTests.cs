using MpptArena.Numerics;

namespace MpptArena.Tests.Numerics;

public class LambertWTests
{
    // Source: R. M. Corless et al., "On the Lambert W function", Adv. Comput. Math. 5 (1996); NIST DLMF 4.13.
    [Theory]
    [InlineData(1.0, 0.5671432904097838)] // omega constant
    [InlineData(Math.E, 1.0)]
    [InlineData(10.0, 1.7455280027406994)]
    [InlineData(100.0, 3.3856301402900502)]
    [InlineData(1000.0, 5.2496028524015962)]
    [InlineData(0.5, 0.3517337112491958)]
    [InlineData(-0.36787944117144233, -1.0)] // W(-1/e) = -1
    [InlineData(0.0, 0.0)]
    public void PrincipalBranchMatchesPublishedValues(double x, double expected)
    {
        Assert.True(Math.Abs(LambertW.W0(x) - expected) <= 2e-15 * Math.Max(1.0, Math.Abs(expected)) + (x < -0.3 ? 1e-7 : 0));
    }

    [Fact]
    public void DefiningIdentityHoldsOverManyDecades()
    {
        // Definition: W(x) e^W(x) = x (Corless et al. 1996, eq. 1.1).
        for (double lg = -300; lg <= 300; lg += 0.37)
        {
            double x = Math.Pow(10, lg);
            double w = LambertW.W0(x);
            // Compare in log space so that huge x do not overflow: ln w + w = ln x.
            double lhs = Math.Log(w) + w;
            Assert.True(Math.Abs(lhs - Math.Log(x)) <= 1e-13 * Math.Max(1.0, Math.Abs(Math.Log(x))), $"x = 1e{lg}");
        }
        for (double x = -0.3678; x < 0; x += 0.01)
        {
            double w = LambertW.W0(x);
            Assert.True(Math.Abs(w * Math.Exp(w) - x) <= 1e-15, $"x = {x}");
        }
    }

    // Source: REFERENCES.md, Wright omega values computed in 50-digit arithmetic (derived).
    [Theory]
    [InlineData(-2.0, 0.1200282389876412)]
    [InlineData(0.5, 0.7662486081617503)]
    [InlineData(10.0, 7.929420095019697)]
    [InlineData(1000.0, 993.0991694723891)]
    public void WrightOmegaMatchesHighPrecisionValues(double z, double expected)
    {
        Assert.True(Math.Abs(LambertW.WrightOmega(z) - expected) <= 4e-16 * expected + 1e-17);
    }

    [Fact]
    public void WrightOmegaSolvesItsEquationWhereExpOverflows()
    {
        // Definition: omega + ln omega = z (Lawrence, Corless, Jeffrey, ACM TOMS 38(3), 2012).
        foreach (double z in new[] { 709.0, 710.0, 1e4, 1e8, 1e15, -50.0, -700.0 })
        {
            double w = LambertW.WrightOmega(z);
            Assert.True(double.IsFinite(w) && w > 0, $"z = {z}");
            if (z > -30) Assert.True(Math.Abs(w + Math.Log(w) - z) <= 1e-14 * Math.Abs(z), $"z = {z}");
            else Assert.Equal(Math.Exp(z), w, Math.Exp(z) * 1e-12);
        }
    }
}
