using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using MpptArena.Arrays;
using MpptArena.Plant;
using MpptArena.Scenarios;
using MpptArena.Scoring;
using MpptArena.Sensing;
using MpptArena.Trackers;

namespace MpptArena.Runs;

/// <summary>
/// Runs every tracker of a scenario in lock-step, each against its own copy of the plant, all sharing
/// one environment and one prepared array curve (they see the same sky).
/// </summary>
/// <remarks>
/// Per plant step h: (1) at every environment step the irradiance, temperature and shading are
/// evaluated at the step's start and held; the curve is re-prepared when they moved beyond the
/// thresholds (<see cref="ArrayCurveCache"/>); (2) each front end advances by h (exponentially in
/// one piece where its closed loop allows, otherwise split into equal sub-steps within the integrator's
/// stability limit for the plant's fastest mode);
/// (3) the scorer takes the step; (4) the ADCs convert where the averaging schedule says; (5) at each
/// tracker sample instant the tracker is called and its command takes effect from the next step.
/// </remarks>
public sealed class ScenarioRunner
{
    /// <summary>RK4's stability limit on the negative real axis is h|lambda| &lt; 2.785; this margin is used.</summary>
    public const double StabilityLimit = 2.0;

    /// <summary>Runs <paramref name="scenario"/>.</summary>
    /// <param name="scenario">The scenario.</param>
    /// <param name="sinkFor">Series sink per tracker, or null for none.</param>
    /// <param name="progress">Receives the finished fraction [0, 1], or null.</param>
    /// <param name="cancel">Stops the run between steps.</param>
    /// <param name="logFor">Where each tracker's own output goes (its host's standard error), or null to drop it.</param>
    public RunResult Run(Scenario scenario, Func<TrackerSpec, ISeriesSink?>? sinkFor = null, IProgress<double>? progress = null, CancellationToken cancel = default,
        Func<TrackerSpec, TextWriter?>? logFor = null)
    {
        var lanes = new List<TrackerLane>();
        try
        {
            return Run(scenario, sinkFor, progress, cancel, logFor, lanes);
        }
        finally
        {
            // Hosts go back to the pool (or are ended) and files are closed however the run ends.
            foreach (var lane in lanes)
            {
                lane.Release();
                lane.Sink?.Dispose();
            }
        }
    }

    private RunResult Run(Scenario scenario, Func<TrackerSpec, ISeriesSink?>? sinkFor, IProgress<double>? progress, CancellationToken cancel,
        Func<TrackerSpec, TextWriter?>? logFor, List<TrackerLane> lanes)
    {
        var wall = Stopwatch.StartNew();
        var sim = scenario.Simulation;
        double h = sim.PlantStepS;
        long totalSteps = (long)Math.Round(sim.DurationS / h);
        int envEvery = Math.Max(1, (int)Math.Round(sim.EnvironmentStepS / h));
        var env = scenario.Environment;
        int substrings = scenario.Array.Layout.SubstringCount;
        var conditions = new ArrayConditions(substrings);
        var factors = new double[substrings];
        var previousFactors = new double[substrings];
        var cache = new ArrayCurveCache(scenario.Array, sim.ReprepareIrradianceWm2, sim.ReprepareTemperatureC);
        var cursor = new Environment.EnvironmentCursor();
        env.Evaluate(0.0, conditions, factors, cursor);
        Array.Copy(factors, previousFactors, substrings);
        cache.Update(conditions);

        double maxConductanceS = MaxConductanceS(scenario);
        foreach (var spec in scenario.Trackers) lanes.Add(CreateLane(scenario, spec, h, sinkFor, logFor));
        foreach (var lane in lanes)
        {
            lane.FrontEnd.SetStabilityBound(maxConductanceS, StabilityLimit);
            lane.FrontEnd.Reset(cache.Curve.OpenCircuitVoltageV);
            lane.Scorer.MarkEvent(0.0, TrackerScorer.StartupLabel);
            lane.Start();
            lane.NextSeriesS = sim.SeriesIntervalS;
        }

        var snapshots = new List<CurveSnapshot>();
        var snapshotTimes = scenario.Scoring.SnapshotTimes.OrderBy(t => t).ToList();
        int nextSnapshot = 0;
        double lastChangeS = 0, lastTickS = 0;
        long reportEvery = Math.Max(1, totalSteps / 200);

        for (long n = 1; n <= totalSteps; n++)
        {
            double tStart = (n - 1) * h, t = n * h;
            if ((n - 1) % envEvery == 0 && n > 1)
            {
                // Nothing below runs per substring unless the sky actually moved since the last tick.
                bool changed = env.Evaluate(tStart, conditions, factors, cursor);
                string? eventLabel = DetectEvent(scenario, cursor, lastTickS, tStart, changed, factors, previousFactors);
                if (changed || eventLabel is not null) lastChangeS = tStart;
                if (changed)
                {
                    Array.Copy(factors, previousFactors, substrings);
                    cache.Update(conditions);
                }
                if (eventLabel is not null)
                {
                    foreach (var lane in lanes) if (lane.Failure is null) lane.Scorer.MarkEvent(tStart, eventLabel);
                }
                lastTickS = tStart;
            }
            while (nextSnapshot < snapshotTimes.Count && snapshotTimes[nextSnapshot] <= tStart + 1e-12)
            {
                snapshots.Add(Snapshot(tStart, cache));
                nextSnapshot++;
            }

            var curve = cache.Curve;
            var peaks = cache.Peaks;
            var mpp = peaks.Global;
            bool multi = peaks.Peaks.Count > 1;
            foreach (var lane in lanes)
            {
                if (lane.Failure is not null)
                {
                    lane.Scorer.ObserveAfterFailure(h, mpp.PowerW);
                    continue;
                }
                double e0 = lane.FrontEnd.Energy.FromArrayJ;
                var kind = lane.Tracker.CommandKind;
                lane.FrontEnd.Step(h, curve, lane.Command, kind);
                double p = (lane.FrontEnd.Energy.FromArrayJ - e0) / h;
                double v = lane.FrontEnd.PvVoltageV;
                lane.Scorer.Observe(new PlantSample(t, h, v, p, mpp.PowerW, mpp.VoltageV, multi, peaks.IsOnGlobalHill(v), t - lastChangeS, lane.Command));
                if (lane.Sink is not null) WriteSeries(lane, sim.SeriesIntervalS, t, v, lane.FrontEnd.PvCurrentA, p, mpp, h);

                // The current is evaluated only where something reads it (the front ends compute it lazily).
                int stepInSample = (int)((n - 1) % lane.StepsPerSample);
                lane.Sensors.OnPlantStep(stepInSample, lane.FrontEnd);
                if (stepInSample == lane.StepsPerSample - 1)
                {
                    var (vc, ic, vs, cs, conversions) = lane.Sensors.TakeSample();
                    lane.Sample(new TrackerMeasurement(t, vs, cs, vc, ic, lane.Command, conversions));
                    if (lane.Failure is null) lane.Scorer.ObserveCommand(t, lane.Command, mpp.VoltageV);
                }
            }
            if (n % reportEvery == 0)
            {
                cancel.ThrowIfCancellationRequested();
                progress?.Report((double)n / totalSteps);
            }
        }

        double end = totalSteps * h;
        var results = lanes.Select(lane =>
        {
            lane.Release();
            lane.Sink?.Dispose();
            var scores = lane.Scorer.Finish(end);
            double meanNs = lane.TimedCalls > 0 ? lane.ComputeTicks * 1e9 / Stopwatch.Frequency / lane.TimedCalls : 0;
            double dcm = lane.FrontEnd.DiscontinuousTimeS;
            return new TrackerResult(lane.Spec.Name, lane.Spec.Descriptor.Kind, lane.Spec.SamplePeriodS, lane.Spec.Settings.All,
                lane.Failure is null ? scores : null, lane.Failure, lane.Calls, meanNs, double.IsNaN(dcm) ? null : dcm)
            {
                EnergySplit = scores.EnergySplit,
                Stall = scores.Stall,
            };
        }).ToList();
        progress?.Report(1.0);
        return new RunResult(scenario.Name, scenario.Description, sim.Seed, PlantDigest(scenario), end, h, results, snapshots,
            cache.Preparations, wall.Elapsed.TotalSeconds);
    }

    /// <summary>
    /// Sub-steps per plant step that an explicitly integrated step needs so that h |lambda_max| stays within
    /// <see cref="StabilityLimit"/> (the front ends split a step themselves; exponential steps need none).
    /// </summary>
    public static int SubstepsFor(Scenario scenario, double plantStepS)
    {
        double rate = CreateFrontEnd(scenario.Converter).FastestRateEstimatePerS(MaxConductanceS(scenario));
        return Math.Max(1, (int)Math.Ceiling(plantStepS * rate / StabilityLimit));
    }

    /// <summary>The array's largest incremental conductance [S]: near and above open circuit, brightest and coldest.</summary>
    public static double MaxConductanceS(Scenario scenario)
    {
        var bright = scenario.Array.UniformConditions(1500, -40);
        var curve = new PreparedArrayCurve(scenario.Array.Solve(bright));
        curve.CurrentAtVoltage(1.1 * curve.OpenCircuitVoltageV, out double slope);
        return Math.Abs(slope);
    }

    /// <summary>The front end a converter description asks for.</summary>
    public static IFrontEnd CreateFrontEnd(ConverterSettings c) => c.Kind switch
    {
        FrontEndKind.IdealSource => new IdealSourceFrontEnd(c),
        FrontEndKind.Boost => new BoostFrontEnd(c),
        FrontEndKind.Buck => new BuckFrontEnd(c),
        _ => throw new ArgumentOutOfRangeException(nameof(c)),
    };

    private static TrackerLane CreateLane(Scenario scenario, TrackerSpec spec, double h, Func<TrackerSpec, ISeriesSink?>? sinkFor, Func<TrackerSpec, TextWriter?>? logFor)
    {
        var frontEnd = CreateFrontEnd(scenario.Converter);
        var tracker = spec.Descriptor.Create(spec.Settings);
        var log = logFor?.Invoke(spec) is { } writer ? TextWriter.Synchronized(writer) : null;
        if (tracker is Trackers.Isolation.IContainedTracker contained)
        {
            contained.Limits = spec.Limits;
            contained.Log = log;
        }
        var kind = tracker.CommandKind;
        if (!frontEnd.Accepts(kind))
        {
            throw new ArenaInputException($"tracker '{spec.Name}' commands {Scenarios.TrackerEntryReader.Describe(kind)}, which the {Scenarios.TrackerEntryReader.ConverterName(scenario.Converter.Kind)} converter does not take; use a boost or buck converter", "converter");
        }
        var (min, max) = frontEnd.CommandRange(kind);
        if (!SimulationSettings.IsWholeNumberOfSteps(spec.SamplePeriodS, h))
        {
            throw new ArenaInputException($"tracker '{spec.Name}': period {spec.SamplePeriodS * 1e3:0.###} ms is not a whole number of plant steps ({h * 1e6:0.###} us); choose a period that is a multiple of the plant step or set simulation.plant_step_us to a divisor of it", "period_ms");
        }
        int stepsPerSample = Math.Max(1, (int)Math.Round(spec.SamplePeriodS / h));
        var sensors = scenario.Sensors;
        var context = new TrackerContext(stepsPerSample * h, min, max, scenario.NominalOpenCircuitVoltageV, scenario.NominalShortCircuitCurrentA,
            sensors.Voltage.LeastSignificantBit, sensors.Current.LeastSignificantBit, sensors.Voltage.Bits, sensors.Current.Bits);
        // Each tracker gets the same noise stream: differences between trackers are theirs, not the dice's.
        var chain = new SensorChain(sensors, stepsPerSample, h, scenario.Simulation.Seed);
        return new TrackerLane
        {
            Spec = spec,
            Tracker = tracker,
            FrontEnd = frontEnd,
            Sensors = chain,
            Scorer = new TrackerScorer(scenario.Scoring),
            Context = context,
            StepsPerSample = stepsPerSample,
            Sink = sinkFor?.Invoke(spec),
            Log = log,
            Watch = spec.Descriptor.IsUserCodeInProcess ? new Trackers.Isolation.InProcessCallWatch(spec.Name, spec.Limits.CallS) : null,
        };
    }

    private static string? DetectEvent(Scenario scenario, Environment.EnvironmentCursor cursor, double fromS, double toS, bool changed, double[] factors, double[] previous)
    {
        var env = scenario.Environment;
        string? profileEvent = env.ProfileBreakpointIn(fromS + 1e-12, toS + 1e-12, cursor);
        if (profileEvent is not null) return profileEvent;
        if (!changed || env.Shading.Count == 0) return null;
        for (int k = 0; k < factors.Length; k++)
        {
            if (Math.Abs(factors[k] - previous[k]) > 0.01) return "shading change";
        }
        return null;
    }

    private static void WriteSeries(TrackerLane lane, double interval, double t, double v, double i, double p, PowerPeak mpp, double h)
    {
        var frontEnd = lane.FrontEnd;
        lane.SumV += v; lane.SumI += i; lane.SumP += p; lane.SumPmpp += mpp.PowerW; lane.SeriesCount++;
        lane.SumInductorA += frontEnd.InductorCurrentA; lane.SumDuty += frontEnd.DutyCycle;
        if (interval > 0 && t < lane.NextSeriesS - 0.5 * h) return;
        int c = lane.SeriesCount;
        double dcm = frontEnd.DiscontinuousTimeS;
        lane.Sink!.Write(new SeriesRow(t, lane.SumV / c, lane.SumI / c, lane.SumP / c, lane.SumPmpp / c, mpp.VoltageV, lane.Command,
            lane.SumInductorA / c, lane.SumDuty / c, Math.Clamp((dcm - lane.SeriesDiscontinuousS) / (c * h), 0.0, 1.0)));
        lane.SeriesDiscontinuousS = dcm;
        lane.SumV = lane.SumI = lane.SumP = lane.SumPmpp = lane.SumInductorA = lane.SumDuty = 0;
        lane.SeriesCount = 0;
        lane.NextSeriesS += interval;
    }

    private static CurveSnapshot Snapshot(double t, ArrayCurveCache cache)
    {
        const int points = 400;
        var curve = cache.Curve;
        double voc = curve.OpenCircuitVoltageV;
        var v = new double[points + 1];
        var p = new double[points + 1];
        for (int k = 0; k <= points; k++)
        {
            v[k] = voc * k / points;
            p[k] = v[k] * Math.Max(curve.CurrentAtVoltage(v[k]), 0.0);
        }
        return new CurveSnapshot(t, v, p, cache.Peaks);
    }

    /// <summary>A short digest of everything that defines the plant, so two summaries can tell whether they scored the same hardware.</summary>
    public static string PlantDigest(Scenario s)
    {
        var inv = CultureInfo.InvariantCulture;
        var r = s.Array.Module.Reference;
        var text = string.Join("|",
            string.Format(inv, "{0:R},{1:R},{2:R},{3:R},{4:R},{5},{6:R}", r.PhotocurrentA, r.SaturationCurrentA, r.ModifiedIdealityV, r.SeriesResistanceOhm, r.ShuntConductanceS, s.Array.Module.CellsInSeries, s.Array.Module.IscTemperatureCoefficientAPerK),
            s.Array.Layout, s.Array.Layout.Blocking?.ToString() ?? "none",
            s.Converter, s.Sensors.Voltage, s.Sensors.Current);
        var hash = SHA256.HashData(Encoding.UTF8.GetBytes(text));
        return Convert.ToHexStringLower(hash)[..16];
    }
}
