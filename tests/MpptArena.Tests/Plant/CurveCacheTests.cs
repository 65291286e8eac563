using MpptArena.Arrays;
using MpptArena.Plant;

namespace MpptArena.Tests.Plant;

public class CurveCacheTests
{
    [Fact]
    public void ReprepareRuleBoundsPowerError()
    {
        // ArrayCurveCache: between preparations each substring is within dG of its prepared irradiance, so by
        // De Soto (2006) eq. 3 (IL linear in G) the current error is at most about n_parallel dG/1000 Isc_ref.
        const double dG = 1.0;
        var array = ReferenceModules.Array(10, 2);
        var cache = new ArrayCurveCache(array, dG, 0.2);
        // 36 degC lies on the temperature grid (twice the 0.2 K threshold), so only irradiance drifts here.
        var prepared = array.UniformConditions(700, 36);
        prepared.IrradianceWm2[4] = 300;
        Assert.True(cache.Update(prepared));
        var drifted = prepared.Clone();
        for (int k = 0; k < drifted.IrradianceWm2.Length; k++) drifted.IrradianceWm2[k] += dG * 0.999;
        Assert.False(cache.Update(drifted));
        var truth = array.Solve(drifted);
        double iscRef = 9.5 * 2;
        double bound = iscRef * dG / 1000 * 1.05;
        double voc = truth.OpenCircuitVoltageV;
        for (int i = 0; i <= 200; i++)
        {
            double v = voc * i / 200;
            Assert.True(Math.Abs(cache.Curve.CurrentAtVoltage(v) - truth.CurrentAtVoltage(v)) <= bound, $"at {v:F1} V");
        }
        drifted.IrradianceWm2[0] += 0.01; // now beyond dG for substring 0
        Assert.True(cache.Update(drifted));
        Assert.Equal(2, cache.Preparations);
    }

    [Fact]
    public void ReturningToConditionsSeenBeforeReusesTheirCurve()
    {
        // A ramp up and back down passes the same rounded conditions twice: the second pass must serve
        // the stored curves, and they must be the very curves a fresh preparation gives (no state leaks).
        var array = ReferenceModules.Array(10, 2);
        var cache = new ArrayCurveCache(array, 1.0, 0.2);
        var c = array.UniformConditions(400, 36);
        var fresh = new ArrayCurveCache(array, 1.0, 0.2);
        for (double g = 400; g <= 420; g += 0.5) { c.IrradianceWm2.AsSpan().Fill(g); cache.Update(c); }
        int built = cache.Preparations;
        Assert.Equal(11, built); // 400, 402, ..., 420
        for (double g = 420; g >= 400; g -= 0.5)
        {
            c.IrradianceWm2.AsSpan().Fill(g);
            cache.Update(c);
            fresh.Update(c);
            Assert.Equal(fresh.Peaks.Global.PowerW, cache.Peaks.Global.PowerW);
            Assert.Equal(fresh.Curve.CurrentAtVoltage(300), cache.Curve.CurrentAtVoltage(300));
        }
        Assert.Equal(built, cache.Preparations);
        Assert.True(cache.Reuses >= 10);
    }

    [Fact]
    public void AStringWhoseSubstringsKeptTheirConditionsIsNotTabulatedAgain()
    {
        // Two strings; a shade moves over the first only. The second string's curve must be reused, and the
        // array curve must equal one prepared from nothing (Kirchhoff: parallel strings add their currents).
        var array = ReferenceModules.Array(10, 2);
        var cache = new ArrayCurveCache(array, 1.0, 0.2);
        var c = array.UniformConditions(800, 36);
        c.IrradianceWm2[3] = 300;
        cache.Update(c);
        int built = cache.Strings.Built;
        c.IrradianceWm2[3] = 800;
        c.IrradianceWm2[5] = 400;
        Assert.True(cache.Update(c));
        Assert.Equal(built + 1, cache.Strings.Built);
        Assert.True(cache.Strings.Reused >= 1);
        // Series order does not matter (one current through all): the same shade on another substring of
        // the string is the same string curve.
        c.IrradianceWm2[5] = 800;
        c.IrradianceWm2[7] = 400;
        Assert.True(cache.Update(c));
        Assert.Equal(built + 1, cache.Strings.Built);
        var fresh = new PreparedArrayCurve(array.Solve(cache.PreparedConditions));
        for (int k = 0; k <= 100; k++)
        {
            double v = fresh.OpenCircuitVoltageV * k / 100;
            Assert.Equal(fresh.CurrentAtVoltage(v), cache.Curve.CurrentAtVoltage(v), 12);
        }
    }

    [Theory]
    [InlineData(50.0, -20.0)]
    [InlineData(400.0, 30.0)]
    [InlineData(1200.0, 70.0)]
    public void UniformSkyFindsTheSameMppWithItsCoarseScan(double irradianceWm2, double temperatureC)
    {
        // Uniform conditions: one maximum (single-diode power curve, no bypass diode conducting; common
        // practice), so the cache scans coarsely; it must land on the maximum a dense scan finds.
        var array = ReferenceModules.Array(10, 2);
        var cache = new ArrayCurveCache(array, 1.0, 0.2);
        cache.Update(array.UniformConditions(irradianceWm2, temperatureC));
        var dense = MppSearch.FindPeaks(cache.Curve, 4000);
        Assert.Single(cache.Peaks.Peaks);
        Assert.Equal(dense.Global.PowerW, cache.Peaks.Global.PowerW, dense.Global.PowerW * 1e-9);
        Assert.Equal(dense.Global.VoltageV, cache.Peaks.Global.VoltageV, 1e-3);
    }

    [Fact]
    public void ConstantConditionsArePreparedExactlyAsStated()
    {
        // 25 degC is not a multiple of the 0.4 K grid: a constant 25 degC must still be simulated at 25 degC
        // while the irradiance ramps; a value that moved stays on the grid, also at its rest (within dG).
        var array = ReferenceModules.Array(10, 1);
        var cache = new ArrayCurveCache(array, 1.0, 0.2);
        var c = array.UniformConditions(1000, 25);
        cache.Update(c);
        Assert.All(cache.PreparedConditions.CellTemperatureC, t => Assert.Equal(25.0, t));
        Assert.All(cache.PreparedConditions.IrradianceWm2, g => Assert.Equal(1000.0, g));
        for (double g = 1000 - 3.7; g >= 851; g -= 3.7)
        {
            c.IrradianceWm2.AsSpan().Fill(g);
            cache.Update(c);
            Assert.All(cache.PreparedConditions.IrradianceWm2, p => Assert.Equal(Math.Round(g / 2) * 2, p));
            Assert.All(cache.PreparedConditions.CellTemperatureC, t => Assert.Equal(25.0, t));
        }
        c.IrradianceWm2.AsSpan().Fill(850.3);
        cache.Update(c);
        Assert.False(cache.Update(c));
        Assert.All(cache.PreparedConditions.IrradianceWm2, p => Assert.Equal(850.0, p));
        // Once a substring's temperature moves it joins the grid; the others keep their exact 25 degC.
        c.CellTemperatureC[0] = 25.1;
        Assert.True(cache.Update(c));
        Assert.Equal(25.2, cache.PreparedConditions.CellTemperatureC[0], 12);
        Assert.Equal(25.0, cache.PreparedConditions.CellTemperatureC[1]);
    }
}
