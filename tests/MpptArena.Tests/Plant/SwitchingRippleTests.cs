using MpptArena.Arrays;
using MpptArena.Plant;
using MpptArena.Trackers;

namespace MpptArena.Tests.Plant;

/// <summary>The switching waveforms the sensors can see, against textbook ripple expressions and the switched circuit.</summary>
public class SwitchingRippleTests
{
    private static PreparedArrayCurve Curve(int modules, double irradianceWm2)
    {
        var array = ReferenceModules.Array(modules, 1);
        return new PreparedArrayCurve(array.Solve(array.UniformConditions(irradianceWm2, 25)));
    }

    private static AveragedConverter Settled(ConverterSettings s, PreparedArrayCurve curve, double duty)
    {
        AveragedConverter f = s.Kind == FrontEndKind.Boost ? new BoostFrontEnd(s) : new BuckFrontEnd(s);
        f.SetStabilityBound(1.0, 2.0);
        f.Reset(curve.OpenCircuitVoltageV);
        for (int n = 0; n < 10_000; n++) f.Step(200e-6, curve, duty, TrackerCommandKind.DutyCycle);
        return f;
    }

    private static SwitchedConverterReference SettledSwitched(ConverterSettings s, PreparedArrayCurve curve, double duty, double seconds = 1.0)
    {
        var sw = new SwitchedConverterReference(curve, s);
        sw.Reset(curve.OpenCircuitVoltageV, 0);
        for (int k = 0; k < (int)(seconds * s.SwitchingFrequencyHz); k++) sw.Period(duty);
        return sw;
    }

    /// <summary>Peak-to-peak of the PV voltage and inductor current over one period, and the share of the period at zero current.</summary>
    private static (double RippleV, double RippleI, double ZeroShare, double MeanV, double MeanI) Waveform(IFrontEnd f)
    {
        const int n = 4000;
        double vMin = double.MaxValue, vMax = double.MinValue, iMin = double.MaxValue, iMax = double.MinValue, zero = 0, sumV = 0, sumI = 0;
        for (int k = 0; k < n; k++)
        {
            var (v, _, i) = f.InstantAt((k + 0.5) / n);
            vMin = Math.Min(vMin, v); vMax = Math.Max(vMax, v);
            iMin = Math.Min(iMin, i); iMax = Math.Max(iMax, i);
            if (i == 0) zero++;
            sumV += v; sumI += i;
        }
        return (vMax - vMin, iMax - iMin, zero / n, sumV / n, sumI / n);
    }

    [Fact]
    public void BoostRippleInCcmIsTheTextbookValue()
    {
        // Erickson and Maksimovic, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2: inductor ripple
        // delta i = V_L D Ts / L with the inductor's on-state voltage V_L = V_in - R_L I (V_in D Ts / L when
        // lossless); a capacitor carrying a triangular ripple current has delta v = delta i Ts / (8 C).
        var s = new ConverterSettings(FrontEndKind.Boost);
        var curve = Curve(10, 1000);
        var f = Settled(s, curve, 0.5);
        var w = Waveform(f);
        double ts = 1 / s.SwitchingFrequencyHz;
        double expectedI = (f.PvVoltageV - s.InductorResistanceOhm * f.InductorCurrentA) * 0.5 * ts / s.InductanceH;
        Assert.Equal(expectedI, w.RippleI, expectedI * 1e-3);
        Assert.Equal(expectedI * ts / (8 * s.InputCapacitanceF), w.RippleV, expectedI * ts / (8 * s.InputCapacitanceF) * 1e-3);
        Assert.Equal(f.PvVoltageV, w.MeanV, 1e-6);
        Assert.Equal(f.InductorCurrentA, w.MeanI, 1e-6);
        // The middle of the on-time reads the average inductor current (common practice in current sampling).
        Assert.Equal(f.InductorCurrentA, f.InstantAt(0.25).InductorCurrentA, 1e-9);

        var sw = SettledSwitched(s, curve, 0.5);
        Assert.Equal(sw.RippleI, w.RippleI, sw.RippleI * 0.01);
        Assert.Equal(sw.RippleV, w.RippleV, sw.RippleV * 0.05);
    }

    [Fact]
    public void BoostWaveformInDcmMatchesTheSwitchedCircuit()
    {
        // Erickson and Maksimovic (2001), ch. 5: in DCM the current rises from zero to V_in D Ts / L and
        // returns to zero in d2 Ts; the rest of the period it is zero.
        var s = new ConverterSettings(FrontEndKind.Boost);
        var curve = Curve(10, 100);
        var f = Settled(s, curve, 0.4);
        Assert.True(f.IsDiscontinuous);
        var w = Waveform(f);
        double peak = f.PvVoltageV * 0.4 / s.SwitchingFrequencyHz / s.InductanceH;
        Assert.Equal(peak, w.RippleI, peak * 1e-3);
        var sw = SettledSwitched(s, curve, 0.4);
        Assert.Equal(sw.RippleI, w.RippleI, sw.RippleI * 0.01);
        Assert.Equal(sw.ZeroFraction, w.ZeroShare, 0.01);
        Assert.Equal(sw.RippleV, w.RippleV, sw.RippleV * 0.05);
    }

    [Fact]
    public void BuckInputVoltageRippleIsTheTextbookValue()
    {
        // The buck's input capacitor supplies the pulsed switch current: with a small inductor ripple,
        // delta v = I_L D (1 - D) Ts / C (Erickson and Maksimovic 2001, ch. 2, the capacitor's charge balance
        // over the on-time). The exact triangle-topped pulse is checked against the switched circuit.
        var s = new ConverterSettings(FrontEndKind.Buck, InputCapacitanceF: 470e-6, InductanceH: 0.2e-3, BatteryVoltageV: 48,
            SwitchingFrequencyHz: 50e3);
        var curve = Curve(2, 1000);
        var f = Settled(s, curve, 0.74);
        Assert.False(f.IsDiscontinuous);
        var w = Waveform(f);
        var sw = SettledSwitched(s, curve, 0.74, 0.3);
        // Measured when written: 0.08720 V against 0.08725 V; the inductor ripple within 2 % (1.37 A against
        // 1.29 A before the on-state voltage included the R_L i drop).
        Assert.Equal(sw.RippleV, w.RippleV, sw.RippleV * 0.05);
        Assert.Equal(sw.RippleI, w.RippleI, sw.RippleI * 0.02);
        double expected = f.InductorCurrentA * 0.74 * 0.26 / s.SwitchingFrequencyHz / s.InputCapacitanceF;
        Assert.Equal(expected, w.RippleV, expected * 0.02);
    }
}
