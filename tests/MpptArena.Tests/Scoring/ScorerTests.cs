using MpptArena.Scoring;

namespace MpptArena.Tests.Scoring;

public class ScorerTests
{
    private const double Dt = 1e-3;

    private static TrackerScores Score(Func<double, (double P, double V)> f, double durationS, double pmpp = 1000, double vmpp = 300,
        ScoringSettings? settings = null, Action<TrackerScorer, double>? events = null)
    {
        var scorer = new TrackerScorer(settings ?? new ScoringSettings(SettlingBandFraction: 0.02, SettlingHoldS: 0.5, StaticAllowanceS: 0));
        scorer.MarkEvent(0, TrackerScorer.StartupLabel);
        int n = (int)Math.Round(durationS / Dt);
        for (int k = 1; k <= n; k++)
        {
            double t = k * Dt;
            events?.Invoke(scorer, t);
            var (p, v) = f(t);
            scorer.Observe(new PlantSample(t, Dt, v, p, pmpp, vmpp, false, true, t, v));
        }
        return scorer.Finish(n * Dt);
    }

    [Fact]
    public void ConstantPowerAt95PercentOfMppGives95Percent()
    {
        // Definition (IEC 62891:2020, EN 50530:2010): efficiency is the energy ratio.
        var s = Score(_ => (950, 300), 10);
        Assert.Equal(0.95, s.TrackingEfficiency, 12);
        Assert.Equal(10 * 1000 / 3600.0 * 0.05, s.EnergyLostWh, 9);
    }

    [Fact]
    public void FirstOrderApproachGivesTheAnalyticSettlingTime()
    {
        // P(t) = Pmpp (1 - e^(-t/tau)) enters the 2 % band at t = tau ln(50) and stays (first-order response).
        const double tau = 0.2;
        var s = Score(t => (1000 * (1 - Math.Exp(-t / tau)), 300), 5);
        Assert.Equal(tau * Math.Log(50), s.StartupTimeS!.Value, Dt * 1.01);
        Assert.Equal(s.StartupTimeS, s.Settling[0].SettlingTimeS);
    }

    [Fact]
    public void AnEventInsideTheBandSettlesAtZeroWithoutFloatNoise()
    {
        // Power already at the MPP when the event is marked: the settling time is exactly zero (not the
        // 1e-15 s left by subtracting two float instants on the step grid). Common practice.
        // At sample 1001 the event instant 1000 * Dt and the sample's start 1001 * Dt - Dt differ by 2.2e-16 s.
        var s = Score(_ => (1000, 300), 3, events: (scorer, t) =>
        {
            if (Math.Round(t / Dt) == 1001) scorer.MarkEvent((Math.Round(t / Dt) - 1) * Dt, "irradiance change");
        });
        Assert.Equal(2, s.Settling.Count);
        Assert.All(s.Settling, e => Assert.Equal(0.0, e.SettlingTimeS));
    }

    [Fact]
    public void SquareRippleGivesItsPeakToPeak()
    {
        // Power and voltage alternate between two levels inside the band: peak-to-peak is their difference.
        var s = Score(t => ((int)(t / 0.02) % 2 == 0 ? (995, 303) : (985, 297)), 5);
        Assert.Equal(6.0, s.RippleVoltagePeakToPeakV!.Value, 1e-9);
        Assert.Equal(10.0, s.RipplePowerPeakToPeakW!.Value, 1e-9);
        Assert.Equal(10.0, s.RippleMeanLossW!.Value, 0.1);
    }

    [Fact]
    public void ADeliberateDipOutOfTheBandIsAnExcursionNotRipple()
    {
        // Settled at the MPP with +/- 3 V of in-band ripple, then every 2 s a 0.1 s sweep down to half power
        // and 150 V below the MPP (a scan): the ripple stays 6 V peak-to-peak, and the sweep's energy is the
        // excursion loss, 0.5 * 1000 W over 0.1 s four times = 200 J. Energy bookkeeping, common practice.
        var s = Score(t =>
        {
            bool sweep = t > 1 && (t % 2.0) < 0.1 - 1e-9;
            return sweep ? (500, 150) : ((int)(t / 0.02) % 2 == 0 ? (995, 303) : (985, 297));
        }, 9);
        Assert.Equal(6.0, s.RippleVoltagePeakToPeakV!.Value, 1e-9);
        Assert.Equal(4 * 0.1, s.ExcursionTimeS, 1e-9);
        Assert.Equal(4 * 0.1 * 500 / 3600.0, s.ExcursionEnergyLostWh, 1e-9);
        Assert.Equal(10.0, s.RippleMeanLossW!.Value, 0.1);
    }

    [Fact]
    public void NeverSettlingIsAResultNotACrash()
    {
        var s = Score(t => (500, 300), 3, events: (scorer, t) => { if (Math.Abs(t - 1.5) < Dt / 2) scorer.MarkEvent(t, "irradiance change"); });
        Assert.Null(s.StartupTimeS);
        Assert.Null(s.MeanSettlingTimeS);
        Assert.Equal(2, s.EventsNeverSettled);
        Assert.All(s.Settling, e => Assert.Null(e.SettlingTimeS));
    }

    [Fact]
    public void WindowsAreScoredOnTheirOwnAndGroupsAddTheirEnergies()
    {
        var settings = new ScoringSettings(Windows:
        [
            new ScoringWindow("first", 0, 1, 10, "seq"),
            new ScoringWindow("second", 1, 3, 20, "seq"),
        ]);
        var s = Score(t => (t <= 1 ? 900 : 1000, 300), 3, settings: settings);
        Assert.Equal(0.9, s.Windows[0].Efficiency!.Value, 9);
        Assert.Equal(1.0, s.Windows[1].Efficiency!.Value, 9);
        Assert.Equal((900 * 1 + 1000 * 2) / 3000.0, s.Groups.Single().Efficiency!.Value, 9);
    }

    [Fact]
    public void TimeOnALowerHillCountsAgainstGlobalPeakCapture()
    {
        var scorer = new TrackerScorer(new ScoringSettings());
        for (int k = 1; k <= 1000; k++)
        {
            bool onGlobal = k > 250;
            scorer.Observe(new PlantSample(k * Dt, Dt, 300, onGlobal ? 1000 : 600, 1000, 300, true, onGlobal, 1, 300));
        }
        var s = scorer.Finish(1);
        Assert.Equal(0.75, s.GlobalPeakTimeShare!.Value, 9);
        Assert.Equal(0.25 * 400 / 3600, s.LowerPeakEnergyLostWh, 9);
    }
}
