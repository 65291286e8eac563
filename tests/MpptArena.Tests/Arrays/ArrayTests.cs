using MathNet.Numerics.Optimization;
using MpptArena.Arrays;

namespace MpptArena.Tests.Arrays;

public class ArrayTests
{
    /// <summary>One string of ten modules, three substrings each; substrings 0-9 at g1, 10-19 at g2, 20-29 at g3.</summary>
    private static (PvArray Array, ArrayConditions Conditions) ThreeLevelString(double g1, double g2, double g3)
    {
        var array = ReferenceModules.Array(10, 1);
        var c = array.UniformConditions(1000, 25);
        for (int k = 0; k < 30; k++) c.IrradianceWm2[k] = k < 10 ? g1 : k < 20 ? g2 : g3;
        return (array, c);
    }

    [Fact]
    public void StringVoltageIsTheSumOfSubstringVoltagesAtOneCurrent()
    {
        // Kirchhoff's voltage law for series elements.
        var (array, conditions) = ThreeLevelString(1000, 600, 300);
        var curve = array.Solve(conditions);
        var str = curve.Strings[0];
        foreach (double i in new[] { 0.5, 2.0, 2.9, 5.0, 8.0, 9.3 })
        {
            double sum = 0;
            for (int k = 0; k < 30; k++) sum += array.Substring(conditions.IrradianceWm2[k], 25).VoltageAtCurrent(i, out _);
            Assert.Equal(sum, str.VoltageAtCurrent(i, out _), 1e-9);
            Assert.Equal(i, str.CurrentAtVoltage(sum), 1e-9);
        }
    }

    [Fact]
    public void ParallelStringsAddTheirCurrents()
    {
        // Kirchhoff's current law for parallel strings.
        var array = ReferenceModules.Array(4, 2);
        var c = array.UniformConditions(900, 40);
        for (int k = 12; k < 18; k++) c.IrradianceWm2[k] = 350; // half of the second string shaded
        var both = array.Solve(c);
        var lit = ReferenceModules.Array(4, 1).Solve(ReferenceModules.Array(4, 1).UniformConditions(900, 40));
        var shaded = ReferenceModules.Array(4, 1);
        var sc = shaded.UniformConditions(900, 40);
        for (int k = 0; k < 6; k++) sc.IrradianceWm2[k] = 350;
        var shadedCurve = shaded.Solve(sc);
        for (double v = 0; v < 150; v += 7.3)
        {
            Assert.Equal(lit.CurrentAtVoltage(v) + shadedCurve.CurrentAtVoltage(v), both.CurrentAtVoltage(v), 1e-9);
        }
    }

    [Fact]
    public void SubstringGoesNegativeOnlyAsFarAsItsBypassDiodeAllows()
    {
        // Common practice: a bypassed substring sits at minus one diode drop (0.4-0.5 V for Schottky at module current).
        var shaded = ReferenceModules.Array(1, 1).Substring(200, 25);
        double v = shaded.VoltageAtCurrent(9.0, out _);
        Assert.InRange(v, -0.50, -0.38);
    }

    [Fact]
    public void UniformlyLitArrayHasExactlyOneMaximum()
    {
        var array = ReferenceModules.Array(10, 2);
        foreach (double g in new[] { 100.0, 500.0, 1000.0 })
        {
            var peaks = MppSearch.FindPeaks(array.Solve(array.UniformConditions(g, 45)));
            Assert.Single(peaks.Peaks);
        }
    }

    [Theory]
    [InlineData(1000, 600, 300, 3)]
    [InlineData(1000, 1000, 400, 2)]
    [InlineData(1000, 250, 250, 2)]
    public void EachDistinctIrradianceLevelMakesItsOwnPeak(double g1, double g2, double g3, int expectedPeaks)
    {
        // Memory: H. Patel, V. Agarwal, IEEE Trans. Industrial Electronics 55(4), 2008: up to one local
        // maximum per distinct substring irradiance level in a string; with well separated levels, one each.
        var (array, c) = ThreeLevelString(g1, g2, g3);
        var curve = array.Solve(c);
        var peaks = MppSearch.FindPeaks(curve);
        Assert.Equal(expectedPeaks, peaks.Peaks.Count);

        // Independent check: a 4000-point scan and MathNet's golden-section minimiser around its best point.
        double voc = curve.OpenCircuitVoltageV;
        int best = 0; double bestP = 0;
        for (int i = 0; i <= 4000; i++)
        {
            double v = voc * i / 4000;
            double p = v * curve.CurrentAtVoltage(v);
            if (p > bestP) { bestP = p; best = i; }
        }
        var result = GoldenSectionMinimizer.Minimum(
            ObjectiveFunction.ScalarValue(v => -v * curve.CurrentAtVoltage(v)),
            voc * (best - 1) / 4000, voc * (best + 1) / 4000, 1e-9);
        Assert.Equal(-result.FunctionInfoAtMinimum.Value, peaks.Global.PowerW, peaks.Global.PowerW * 1e-6);
        Assert.Equal(result.MinimizingPoint, peaks.Global.VoltageV, voc * 1e-3);
    }

    [Fact]
    public void ArrayCurrentIsContinuousAndMonotoneFromZeroToVoc()
    {
        var (array, c) = ThreeLevelString(1000, 600, 300);
        var twoStrings = ReferenceModules.Array(10, 2, ReferenceModules.Schottky);
        var c2 = twoStrings.UniformConditions(800, 30);
        for (int k = 0; k < 7; k++) c2.IrradianceWm2[k] = 150;
        foreach (var curve in new[] { array.Solve(c), twoStrings.Solve(c2) })
        {
            double voc = curve.OpenCircuitVoltageV;
            double previous = curve.CurrentAtVoltage(0);
            const int n = 6000;
            for (int i = 1; i <= n; i++)
            {
                double now = curve.CurrentAtVoltage(voc * i / n);
                Assert.True(now <= previous + 1e-12, $"rises at {voc * i / n} V");
                Assert.True(previous - now < 0.05 * curve.CurrentAtVoltage(0), $"jumps at {voc * i / n} V");
                previous = now;
            }
            Assert.Equal(0.0, curve.CurrentAtVoltage(voc), 1e-7 * curve.CurrentAtVoltage(0));
        }
    }

    [Theory]
    [InlineData(0.0, 25.0)]
    [InlineData(1500.0, 25.0)]
    [InlineData(800.0, -40.0)]
    [InlineData(800.0, 85.0)]
    public void CurveHasNoNaNOrInfinityAtExtremes(double g, double t)
    {
        var array = ReferenceModules.Array(10, 2, ReferenceModules.Schottky);
        var c = array.UniformConditions(g, t);
        c.IrradianceWm2[3] = g * 0.3;
        var curve = array.Solve(c);
        double top = Math.Max(curve.OpenCircuitVoltageV, 10) * 1.2;
        for (double v = -5; v <= top; v += top / 500)
        {
            Assert.True(double.IsFinite(curve.CurrentAtVoltage(v)), $"V = {v}");
        }
        var peaks = MppSearch.FindPeaks(curve);
        Assert.True(double.IsFinite(peaks.Global.PowerW));
    }

    [Fact]
    public void PreparedCurveStaysWithin0Point01PercentOfMppPowerOfTheExactSolve()
    {
        // Requirement of the plant: interpolation error below 1e-4 of MPP power anywhere on the curve.
        var array = ReferenceModules.Array(6, 2);
        var c = ReferenceModules.RandomShading(array, 25, seed: 7);
        var exact = array.Solve(c);
        var prepared = new PreparedArrayCurve(exact);
        double pmpp = MppSearch.FindPeaks(prepared).Global.PowerW;
        double voc = exact.OpenCircuitVoltageV;
        double worst = 0;
        for (int i = 0; i <= 1500; i++)
        {
            double v = voc * i / 1500;
            worst = Math.Max(worst, Math.Abs(v * (prepared.CurrentAtVoltage(v) - exact.CurrentAtVoltage(v))));
        }
        Assert.True(worst / pmpp < 1e-4, $"worst power error {worst / pmpp:E2} of Pmpp");
    }

    [Fact]
    public void PreparedCurveWithBlockingDiodesStaysWithin0Point01PercentOfMppPower()
    {
        // A silicon blocking diode (0.7 V at 10 A with ideality 1, so Is is about 1.5e-11 A; common practice)
        // bends its drop n Vt ln(1 + I/Is) over some twenty decades of string current. Near the array's
        // open-circuit voltage, where one string is blocked and the other carries a few hundred milliamps,
        // the prepared curve must still meet the plant's requirement against the exact solve.
        var array = ReferenceModules.Array(4, 2, BypassDiode.FromForwardVoltage(0.7, 10.0, 1.0));
        var rng = new Random(778);
        double worstOverStates = 0;
        for (int state = 0; state < 6; state++)
        {
            var c = array.UniformConditions(0, 25);
            for (int k = 0; k < c.IrradianceWm2.Length; k++) c.IrradianceWm2[k] = 100 + 1300 * rng.NextDouble();
            var exact = array.Solve(c);
            var prepared = new PreparedArrayCurve(exact);
            double pmpp = MppSearch.FindPeaks(prepared).Global.PowerW;
            double voc = exact.OpenCircuitVoltageV;
            for (int i = 0; i <= 400; i++)
            {
                double v = voc * (0.8 + 0.2 * i / 400);
                worstOverStates = Math.Max(worstOverStates, Math.Abs(v * (prepared.CurrentAtVoltage(v) - exact.CurrentAtVoltage(v))) / pmpp);
            }
        }
        Assert.True(worstOverStates < 1e-4, $"worst power error {worstOverStates:E2} of Pmpp");
    }

    [Fact]
    public void ExactOpenCircuitVoltageWithBlockingDiodesIsWhereTheStringCurrentsCancel()
    {
        // Kirchhoff's current law at open circuit: the summed string currents are zero, so the string with the
        // higher open-circuit voltage drives the other's blocking-diode leakage (about 1.5e-11 A for a silicon
        // diode of 0.7 V at 10 A, common practice) and sits slightly below its own open-circuit voltage.
        var array = ReferenceModules.Array(10, 2, BypassDiode.FromForwardVoltage(0.7, 10.0, 1.0));
        var c = array.UniformConditions(800, 25);
        for (int k = c.CellTemperatureC.Length / 2; k < c.CellTemperatureC.Length; k++) c.CellTemperatureC[k] = 45; // the second string runs hotter
        var exact = array.Solve(c);
        double voc = exact.OpenCircuitVoltageV;
        double highest = exact.Strings.Max(s => s.VoltageAtCurrent(0.0, out _));
        Assert.True(voc < highest, $"Voc {voc} V is the higher string's own {highest} V");
        Assert.True(exact.CurrentAtVoltage(Math.BitDecrement(Math.BitDecrement(voc))) > 0 && exact.CurrentAtVoltage(Math.BitIncrement(Math.BitIncrement(voc))) < 0, "the current changes sign at Voc");
        Assert.Equal(new PreparedArrayCurve(exact).OpenCircuitVoltageV, voc, 1e-4);
    }

    [Theory]
    [InlineData(DiodeMaterial.Schottky, 0.45, -0.0016, -0.0006)]
    [InlineData(DiodeMaterial.Silicon, 0.70, -0.0021, -0.0011)]
    public void BypassDiodeForwardVoltageFallsAsItWarms(DiodeMaterial material, double forwardV, double minVPerK, double maxVPerK)
    {
        // A diode's forward voltage at fixed current falls with temperature, about 1-2 mV/K (common practice);
        // with the SPICE law (Nagel, ERL-M520, 1975) dVf/dT = (Vf - XTI n Vt - Eg) / T: -0.98 mV/K for a
        // 0.45 V Schottky (Eg 0.69 eV, XTI 2) and -1.63 mV/K for a 0.70 V silicon diode (Eg 1.11 eV, XTI 3)
        // at 25 degC. Checked here on the substring model: the voltage across a fully bypassed substring.
        var diode = BypassDiode.FromForwardVoltage(forwardV, 10.0, 1.0, material);
        double Vf(double t) => diode.IdealityVoltageV(t) * Math.Log(1 + 10.0 / diode.SaturationCurrentAt(t));
        Assert.Equal(forwardV, Vf(25), 1e-12);
        double slope = (Vf(85) - Vf(25)) / 60;
        Assert.InRange(slope, minVPerK, maxVPerK);
        var array = new PvArray(ReferenceModules.Fitted60, new ArrayLayout(3, 1, 1, diode));
        var dark = array.Substring(0, 85);
        Assert.Equal(-Vf(85), dark.VoltageAtCurrent(10.0, out _), 1e-3); // a dark substring carries 10 A through its diode
    }

    [Theory]
    [InlineData(10, 3, 11)]
    [InlineData(10, 3, 12)]
    [InlineData(20, 4, 13)]
    [InlineData(20, 4, 14)]
    [InlineData(20, 4, 15)]
    public void EveryMaximumDownToTheStatedProminenceIsFoundOnParallelStringsWithAllSubstringsDifferent(int modulesPerString, int strings, int seed)
    {
        // Reference: the same strings tabulated 5000 times more finely (1e-8 V per substring) and sampled every
        // 2 mV, with the topographic prominence of each local maximum (its height above the higher of the
        // lowest points separating it from higher ground on either side). Every maximum of at least twice the
        // stated prominence (1e-4 of Pmpp; twice, for the prepared curve's own error of up to 5.4e-5 of Pmpp)
        // must be reported within 20 mV, and every reported one must be a maximum of the reference.
        var array = ReferenceModules.Array(modulesPerString, strings);
        var c = array.UniformConditions(0, 25);
        var rng = new Random(seed);
        for (int k = 0; k < c.IrradianceWm2.Length; k++)
        {
            c.IrradianceWm2[k] = 150 + 850 * rng.NextDouble();
            c.CellTemperatureC[k] = 20 + 30 * rng.NextDouble();
        }
        var exact = array.Solve(c);
        var prepared = new PreparedArrayCurve(exact);
        var found = MppSearch.FindPeaks(prepared);
        double iscMax = exact.Strings.Max(s => s.MaxShortCircuitCurrentA);
        var fine = exact.Strings.Select(s => new PreparedStringCurve(s, -5 * iscMax, 1.02 * iscMax + 1e-3, 1e-8)).ToArray();
        double voc = prepared.OpenCircuitVoltageV;
        int n = (int)(voc / 0.002);
        var p = new double[n + 1];
        for (int i = 0; i <= n; i++)
        {
            double v = voc * i / n, current = 0;
            for (int s = 0; s < fine.Length; s++) current += exact.StringCounts[s] * fine[s].CurrentAtVoltage(v, out _);
            p[i] = v * current;
        }
        double pmax = p.Max();
        // Local maxima of sampled powers with their topographic prominence.
        List<(double V, double Prominence)> Maxima(double[] power)
        {
            var list = new List<(double V, double Prominence)>();
            for (int i = 1; i < n; i++)
            {
                if (!(power[i] > power[i - 1] && power[i] >= power[i + 1])) continue;
                double left = power[i], right = power[i];
                for (int j = i - 1; j >= 0 && power[j] <= power[i]; j--) left = Math.Min(left, power[j]);
                for (int j = i + 1; j <= n && power[j] <= power[i]; j++) right = Math.Min(right, power[j]);
                list.Add((voc * i / n, power[i] - Math.Max(left, right)));
            }
            return list;
        }
        var reference = Maxima(p);
        var clear = reference.Where(r => r.Prominence >= 2 * MppSearch.MinProminenceShare * pmax).ToList();
        Assert.True(clear.Count >= 5, $"the state has only {clear.Count} clear maxima");
        foreach (var r in clear)
        {
            Assert.True(found.Peaks.Any(f => Math.Abs(f.VoltageV - r.V) < 0.02), $"maximum at {r.V:F3} V (prominence {r.Prominence / pmax:E1} of Pmpp) not reported; reported: {string.Join(", ", found.Peaks.Select(f => f.VoltageV.ToString("F3")))}");
        }
        foreach (var f in found.Peaks)
        {
            Assert.True(reference.Any(r => Math.Abs(f.VoltageV - r.V) < 0.02), $"reported maximum at {f.VoltageV:F3} V is not a maximum of the reference");
        }
        Assert.Equal(pmax, found.Global.PowerW, 1e-4 * pmax);

        // The search itself skips nothing: every maximum of the prepared curve sampled every 2 mV with a
        // prominence of at least the stated 1e-4 of Pmpp (plus 5 % for the sampling) is reported.
        var own = new double[n + 1];
        for (int i = 0; i <= n; i++) own[i] = voc * i / n * prepared.CurrentAtVoltage(voc * i / n);
        foreach (var (v, prominence) in Maxima(own).Where(m => m.Prominence >= 1.05 * MppSearch.MinProminenceShare * pmax))
        {
            Assert.True(found.Peaks.Any(f => Math.Abs(f.VoltageV - v) < 0.01), $"prepared-curve maximum at {v:F3} V (prominence {prominence / pmax:E1} of Pmpp) not reported");
        }
    }

    [Fact]
    public void PeaksRefinedOnTheExactSolveSitWhereItsPowerSlopeIsZero()
    {
        // dP/dV = I + V dI/dV = 0 at a maximum of the exact solve (the exact curve's own slope, Kirchhoff's current
        // law over strings whose dV/dI is the sum over their substrings).
        var array = ReferenceModules.Array(4, 2);
        var c = ReferenceModules.RandomShading(array, 30, 21);
        var exact = array.Solve(c);
        var refined = MppSearch.RefineOnExact(MppSearch.FindPeaks(new PreparedArrayCurve(exact)), exact);
        Assert.True(refined.Peaks.Count >= 2);
        foreach (var peak in refined.Peaks)
        {
            double i = exact.CurrentAtVoltage(peak.VoltageV, out double di);
            Assert.True(Math.Abs(i + peak.VoltageV * di) < 1e-9 * exact.ShortCircuitCurrentA, $"dP/dV = {i + peak.VoltageV * di:E2} A at {peak.VoltageV} V");
            Assert.True(peak.PowerW >= (peak.VoltageV - 1e-3) * exact.CurrentAtVoltage(peak.VoltageV - 1e-3) && peak.PowerW >= (peak.VoltageV + 1e-3) * exact.CurrentAtVoltage(peak.VoltageV + 1e-3));
        }
    }
}
