using MpptArena.Environment;

namespace MpptArena.Tests.Environment;

public class ProfileTests
{
    [Fact]
    public void StandardRampSequenceHasTheStandardsSlopesLevelsAndDwells()
    {
        // From memory of EN 50530:2010 + A1:2013 (dynamic MPPT test), as listed in the project references:
        // 10 % -> 50 % of 1000 W/m2, slopes 0.5 ... 50 W/m2/s with repetitions 2, 2, 3, 4, 6, 8, 10, 10, 10, 10, 10; 10 s dwell.
        var b = new ProfileBuilder(100);
        var windows = En50530RampSequence.Append(b, 100, 500, En50530RampSequence.LowRange);
        var p = b.Build();
        Assert.Equal(new[] { 0.5, 1, 2, 3, 5, 7, 10, 14, 20, 30, 50 }, windows.Select(w => w.SlopeWm2PerS).ToArray());
        Assert.Equal(new[] { 2, 2, 3, 4, 6, 8, 10, 10, 10, 10, 10 }, En50530RampSequence.LowRange.Select(x => x.Repetitions).ToArray());
        double expected = 10 + En50530RampSequence.LowRange.Sum(x => x.Repetitions * (2 * 400 / x.SlopeWm2PerS + 20));
        Assert.Equal(expected, p.EndTimeS, 1e-9);
        Assert.Equal(100, p.Values.Min());
        Assert.Equal(500, p.Values.Max());
        // Every sloped segment runs at one of the listed slopes.
        var slopes = new HashSet<double>();
        for (int k = 1; k < p.TimesS.Count; k++)
        {
            double dt = p.TimesS[k] - p.TimesS[k - 1], dv = p.Values[k] - p.Values[k - 1];
            if (dt > 0 && dv != 0) slopes.Add(Math.Round(Math.Abs(dv / dt), 9));
        }
        Assert.Equal(windows.Select(w => w.SlopeWm2PerS).ToHashSet(), slopes);
    }

    [Fact]
    public void HighRangeSequenceRunsFrom30To100Percent()
    {
        var b = new ProfileBuilder(300);
        var windows = En50530RampSequence.Append(b, 300, 1000, En50530RampSequence.HighRange);
        Assert.Equal(new[] { 10.0, 14, 20, 30, 50, 100 }, windows.Select(w => w.SlopeWm2PerS).ToArray());
        Assert.All(En50530RampSequence.HighRange, x => Assert.Equal(10, x.Repetitions));
        Assert.Equal(1000, b.Build().Values.Max());
    }

    [Fact]
    public void ProfileInterpolatesLinearlyAndTakesTheLaterValueAtASteps()
    {
        var p = new ProfileBuilder(100).Hold(1).Ramp(300, 2).Step(50).Hold(1).Build();
        Assert.Equal(100, p.ValueAt(0.5));
        Assert.Equal(200, p.ValueAt(2.0), 12);
        Assert.Equal(50, p.ValueAt(3.0));
        Assert.Equal(50, p.ValueAt(10.0));
    }

    [Fact]
    public void BreakpointSearchCountsAStepOnceAtItsTimeAndNotBefore()
    {
        // Breakpoints at 0, 1, 3 (end of the ramp), 3 (the step) and 4 s; intervals are [from, to).
        var p = new ProfileBuilder(100).Hold(1).Ramp(300, 2).Step(50).Hold(1).Build();
        Assert.True(p.HasBreakpointIn(3.0, 3.5));
        Assert.True(p.HasBreakpointIn(2.5, 3.0 + 1e-12));
        Assert.False(p.HasBreakpointIn(1.5, 3.0));
        Assert.False(p.HasBreakpointIn(3.0 + 1e-9, 4.0));
        Assert.True(p.HasBreakpointIn(3.5, 4.0 + 1e-9));
        Assert.False(p.HasBreakpointIn(4.5, 9.0));
        Assert.Equal(300, p.ValueAt(3.0 - 1e-9), 5);
        Assert.Equal(100, p.ValueAt(-1.0));
    }

    [Fact]
    public void ForwardCursorReadsTheSameValuesAndBreakpointsAsAFullSearch()
    {
        // Steps, ramps and holds; times mostly forward in uneven strides, with jumps back and far ahead.
        var p = new ProfileBuilder(100).Hold(1).Ramp(300, 2).Step(50).Hold(0.5).Ramp(900, 0.25).Step(900).Hold(3).Ramp(0, 7).Build();
        var random = new Random(3);
        int segment = 0, next = 0;
        double t = -1;
        for (int k = 0; k < 5000; k++)
        {
            double from = t;
            t += random.Next(10) switch { 0 => -2.0 * random.NextDouble(), 1 => 3 * random.NextDouble(), _ => 0.01 * random.NextDouble() };
            if (random.Next(50) == 0) t = 3.0; // exactly on the step
            Assert.Equal(p.ValueAt(t), p.ValueAt(t, ref segment));
            Assert.Equal(p.HasBreakpointIn(from, t), p.HasBreakpointIn(from, t, ref next));
            if (t > 20) t = -1;
        }
    }

    [Fact]
    public void CloudPassageRisesAboveClearSkyAtItsEdges()
    {
        // Common practice: cloud-edge enhancement lifts irradiance above clear sky for a few seconds.
        var b = new ProfileBuilder(800);
        new CloudPassage(800, 200, 0.25, 4, 100, 10).AppendTo(b);
        var p = b.Build();
        Assert.Equal(1000, p.Values.Max(), 9);
        Assert.Equal(200, p.Values.Min(), 9);
        Assert.Equal(800, p.Values[^1], 9);
    }

    [Fact]
    public void MovingShadowShadesEverySubstringItTouches()
    {
        var shadow = new MovingShadow(0, 30, 0, 10, 0, 30, 6, 0.4);
        var f = new double[30];
        Array.Fill(f, 1.0);
        shadow.Apply(5.0, f); // front at 15, back at 9: substrings 9..14 shaded
        Assert.Equal(Enumerable.Range(9, 6), Enumerable.Range(0, 30).Where(k => f[k] < 1));
        Assert.All(f.Where(x => x < 1), x => Assert.Equal(0.4, x));
    }
}
