using MpptArena.Arrays;
using MpptArena.Plant;
using MpptArena.Sensing;
using MpptArena.Trackers;

namespace MpptArena.Tests.Sensing;

public class SensorChainTests
{
    /// <summary>A front end whose waveform is known: within a period v = 100 + phase, i_pv = 1 + phase, i_L = 5 + phase.</summary>
    private sealed class KnownWaveform : IFrontEnd
    {
        public bool Accepts(TrackerCommandKind kind) => true;
        public (double Min, double Max) CommandRange(TrackerCommandKind kind) => (0, 1);
        public void Reset(double voltageV) { }
        public void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind) { }
        public double PvVoltageV => 100.5;
        public double PvCurrentA => 1.5;
        public double DutyCycle => 0.5;
        public double InductorCurrentA => 5.5;
        public double DiscontinuousTimeS => 0;
        public EnergyLedger Energy => default;
        public double StoredJ => 0;
        public double FastestRateEstimatePerS(double maxConductanceS) => 0;
        public void SetStabilityBound(double maxConductanceS, double stabilityLimit) { }
        public (double VoltageV, double PvCurrentA, double InductorCurrentA) InstantAt(double phase) => (100 + phase, 1 + phase, 5 + phase);
    }

    /// <summary>16-bit, noise-free channels (LSB 7.6 mV and 0.15 mA) reading one sample of <paramref name="conversions"/> conversions.</summary>
    private static (double V, double I) Sample(CurrentSignal measures, RippleSettings? ripple, int conversions = 1, ulong seed = 1)
    {
        var settings = new SensorSettings(new AdcChannelSettings(16, 500, AveragingSamples: conversions), new AdcChannelSettings(16, 10, AveragingSamples: conversions), measures, ripple);
        var chain = new SensorChain(settings, 1, 1e-3, seed);
        chain.OnPlantStep(0, new KnownWaveform());
        var (_, _, v, i, n) = chain.TakeSample();
        Assert.Equal(conversions, n);
        return (v, i);
    }

    [Fact]
    public void TheCurrentChannelReadsWhatItIsSetToMeasure()
    {
        Assert.Equal(1.5, Sample(CurrentSignal.PvCurrent, null).I, 3e-4);
        Assert.Equal(5.5, Sample(CurrentSignal.InductorCurrent, null).I, 3e-4);
        Assert.Equal(100.5, Sample(CurrentSignal.InductorCurrent, null).V, 0.01);
    }

    [Fact]
    public void CarrierTriggeredConversionsSeeTheirPhaseAndFreeRunningOnesEveryPhase()
    {
        var carrier = Sample(CurrentSignal.InductorCurrent, new RippleSettings(true, 0.3));
        Assert.Equal(100.3, carrier.V, 0.01);
        Assert.Equal(5.3, carrier.I, 3e-4);
        Assert.Equal(1.3, Sample(CurrentSignal.PvCurrent, new RippleSettings(true, 0.3)).I, 3e-4);
        // Free running: phases uniform on [0, 1), so 4000 conversions average to the period mean within
        // a few standard errors (1/sqrt(12 n) = 0.0046); the same seed gives the same phases, another seed others.
        var free = Sample(CurrentSignal.InductorCurrent, new RippleSettings(false, 0), 4000);
        Assert.Equal(5.5, free.I, 0.015);
        Assert.Equal(free, Sample(CurrentSignal.InductorCurrent, new RippleSettings(false, 0), 4000));
        Assert.NotEqual(free, Sample(CurrentSignal.InductorCurrent, new RippleSettings(false, 0), 4000, seed: 2));
    }

    [Theory]
    [InlineData("sensors.ripple", "ripple: { trigger: carrier }")]
    [InlineData("sensors.current.measures", "measures: inductor")]
    public void TheIdealSourceRefusesWhatOnlyASwitchingConverterHas(string what, string yaml)
    {
        string sensors = what == "sensors.ripple"
            ? "voltage: { bits: 16, full_scale_v: 500 }\n  current: { bits: 16, full_scale_a: 12 }\n  " + yaml
            : "voltage: { bits: 16, full_scale_v: 500 }\n  current: { bits: 16, full_scale_a: 12, " + yaml + " }";
        var e = Assert.Throws<ArenaInputException>(() => TestScenarios.Parse(TestScenarios.Yaml(sensors: sensors)));
        Assert.Contains("switching converter", e.Message);
        Assert.NotNull(e.Location);
        Assert.NotNull(TestScenarios.Parse(TestScenarios.Yaml(converter: "type: boost", sensors: sensors)));
    }
}
