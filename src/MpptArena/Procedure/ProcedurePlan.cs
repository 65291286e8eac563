using System.Globalization;
using MpptArena.Arrays;
using MpptArena.Environment;
using MpptArena.Scenarios;
using MpptArena.Scoring;

namespace MpptArena.Procedure;

/// <summary>
/// Expands the procedure into its independent operating points, each a complete scenario on the user's converter,
/// sensors, trackers and time stepping: the static points (every power level at the minimum, rated and maximum MPP
/// voltage), the two ramp sequences and the start-up and shut-down ramp at the rated voltage.
/// </summary>
public static class ProcedurePlan
{
    /// <summary>Window of a static point whose efficiency is its result.</summary>
    public const string MeasurementWindow = "measurement";

    /// <summary>Groups of the ramp sequences' windows and the start-up window.</summary>
    public const string LowGroup = "dynamic_low", HighGroup = "dynamic_high", StartUpWindow = "start_up_shut_down";

    /// <summary>Cell temperature of every point [degC]: STC.</summary>
    public const double CellTemperatureC = 25;

    /// <summary>Every point, in a fixed order.</summary>
    /// <param name="plant">The user's scenario: converter, sensors, trackers, simulation and scoring settings (its environment is replaced).</param>
    /// <param name="settings">The procedure's settings.</param>
    public static IReadOnlyList<ProcedurePoint> Points(Scenario plant, ProcedureSettings settings)
    {
        var points = new List<ProcedurePoint>();
        var c = CultureInfo.InvariantCulture;
        var voltages = settings.Shape is null
            ? [("own", settings.RatedMppVoltageV)]
            : new[] { ("min", settings.MinMppVoltageV), ("rated", settings.RatedMppVoltageV), ("max", settings.MaxMppVoltageV) }.DistinctBy(v => v.Item2).ToArray();
        foreach (var (label, voltage) in voltages)
        {
            foreach (double level in ProcedureTable.StaticLevels)
            {
                string name = string.Create(c, $"static-{level * 100:0}pct-{label}-{voltage:0.#}v");
                // The test array is set per point (its MPP at the level's power and the voltage); the scenario's own
                // array is dimmed to the level instead.
                var (array, irradiance) = settings.Shape is { } shape
                    ? (ProcedureTestArray.Build(shape, level * settings.RatedPowerW, voltage), 1000.0)
                    : (plant.Array, 1000.0 * level);
                double duration = settings.StabilisationS + settings.MeasurementS;
                var profile = new ProfileBuilder(irradiance).Hold(duration).Build();
                var windows = new List<ScoringWindow> { new(MeasurementWindow, settings.StabilisationS, duration) };
                points.Add(new ProcedurePoint(ProcedurePointKind.Static, Make(plant, settings, name, array, profile, duration, windows), level, voltage, MeasurementWindow));
            }
        }
        var rated = settings.Shape is { } s ? ProcedureTestArray.Build(s, settings.RatedPowerW, settings.RatedMppVoltageV) : plant.Array;
        if (settings.Dynamic)
        {
            points.Add(Ramps(plant, settings, rated, LowGroup, 100, 500, En50530RampSequence.LowRange));
            points.Add(Ramps(plant, settings, rated, HighGroup, 300, 1000, En50530RampSequence.HighRange));
        }
        if (settings.StartUpShutDown)
        {
            var (low, high, slope, dwell) = ProcedureTable.StartUpShutDown;
            var b = new ProfileBuilder(low * 1000).Hold(dwell).RampAtRate(high * 1000, slope).Hold(dwell).RampAtRate(low * 1000, slope).Hold(dwell);
            double duration = b.TimeS;
            var windows = new List<ScoringWindow> { new(StartUpWindow, 0, duration) };
            points.Add(new ProcedurePoint(ProcedurePointKind.StartUpShutDown, Make(plant, settings, "start-up-shut-down", rated, b.Build(), duration, windows), null,
                settings.RatedMppVoltageV, StartUpWindow));
        }
        return points;
    }

    private static ProcedurePoint Ramps(Scenario plant, ProcedureSettings settings, PvArray array, string group, double lowWm2, double highWm2, IReadOnlyList<En50530RampSequence.Block> blocks)
    {
        var builder = new ProfileBuilder(lowWm2);
        var chosen = blocks.Take(settings.MaxSlopes ?? blocks.Count).ToList();
        var blockWindows = En50530RampSequence.Append(builder, lowWm2, highWm2, chosen);
        var windows = blockWindows.Select(w => new ScoringWindow($"{group}_{w.SlopeWm2PerS.ToString(CultureInfo.InvariantCulture)}_w_m2_s", w.StartS, w.EndS, w.SlopeWm2PerS, group)).ToList();
        double duration = builder.TimeS;
        return new ProcedurePoint(ProcedurePointKind.Dynamic, Make(plant, settings, group.Replace('_', '-'), array, builder.Build(), duration, windows), null, settings.RatedMppVoltageV, group);
    }

    private static Scenario Make(Scenario plant, ProcedureSettings settings, string name, PvArray array, PiecewiseLinearProfile irradiance, double durationS,
        IReadOnlyList<ScoringWindow> windows)
    {
        var environment = new EnvironmentModel(irradiance, new TemperatureModel(new ProfileBuilder(CellTemperatureC).Build(), null), []);
        // The point's identity for resuming: the user's file, the procedure's settings and this point.
        string digest = ContentDigest.OfParts([plant.InputDigest, settings.ToString(), name, ArrayText(array)]);
        return plant with
        {
            Name = name,
            Description = $"MPPT efficiency procedure point {name}",
            Array = array,
            Environment = environment,
            Simulation = plant.Simulation with { DurationS = durationS },
            Scoring = plant.Scoring with { Windows = windows, CurveSnapshotTimesS = [] },
            InputDigest = digest,
        };
    }

    private static string ArrayText(PvArray a) => string.Create(CultureInfo.InvariantCulture,
        $"{a.Module.Reference.PhotocurrentA:R},{a.Module.Reference.SaturationCurrentA:R},{a.Module.Reference.ModifiedIdealityV:R},{a.Module.Reference.SeriesResistanceOhm:R},{a.Module.Reference.ShuntConductanceS:R},{a.Layout}");
}
