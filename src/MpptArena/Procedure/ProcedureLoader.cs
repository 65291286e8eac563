using System.Globalization;
using MpptArena.Plant;
using MpptArena.Pv;
using MpptArena.Scenarios;
using MpptArena.Trackers;

namespace MpptArena.Procedure;

/// <summary>
/// Reads a procedure file: a scenario (its converter, sensors, trackers, simulation and scoring settings; its
/// environment is replaced) with a 'procedure' section, every problem reported with its position.
/// </summary>
public static class ProcedureLoader
{
    private static readonly string[] Keys = ["rated_power_w", "mpp_voltage_v", "test_array", "stabilisation_s", "measurement_s", "dynamic", "start_up_shut_down", "max_slopes"];

    /// <summary>The user's scenario and the procedure's settings.</summary>
    public static (Scenario Plant, ProcedureSettings Settings) Load(string path, TrackerRegistry registry)
    {
        var plant = ScenarioLoader.Load(path, registry);
        var root = new YamlMap(YamlInput.ReadRoot(YamlInput.ReadText(path, "procedure file"), path, "a scenario mapping"), path, "scenario", ScenarioLoader.TopKeys);
        var p = root.Map("procedure", Keys)
            ?? throw new ArenaInputException("missing section 'procedure': expected rated_power_w, mpp_voltage_v { min, rated, max } and test_array (crystalline_silicon, thin_film or scenario)", "procedure", root.Location);
        string arrayName = p.Text("test_array", "crystalline_silicon", ["crystalline_silicon", "thin_film", "scenario"]);
        var shape = ProcedureTable.ShapeNamed(arrayName);
        double stabilisation = p.Number("stabilisation_s", ProcedureTable.DefaultStabilisationS, 0, 86_400);
        double measurement = p.Positive("measurement_s", ProcedureTable.DefaultMeasurementS, 86_400);
        bool dynamic = Flag(p, "dynamic"), startUp = Flag(p, "start_up_shut_down");
        int? maxSlopes = p.Has("max_slopes") ? p.Integer("max_slopes", null, 1, 11) : null;
        ProcedureSettings settings;
        if (shape is null)
        {
            // The scenario's own array: its STC maximum is the rated point.
            var mpp = SingleDiodeModel.MaximumPowerPoint(plant.Array.Module.Reference);
            double v = mpp.VoltageV * plant.Array.Layout.ModulesPerString;
            double w = mpp.VoltageV * mpp.CurrentA * plant.Array.Layout.ModulesPerString * plant.Array.Layout.StringsInParallel;
            foreach (string key in new[] { "rated_power_w", "mpp_voltage_v" })
            {
                if (p.Node(key) is { } n) throw p.Error(n, $"'{key}' goes with a test array; with 'test_array: scenario' the scenario's own array sets the power and voltage", key);
            }
            settings = new ProcedureSettings(w, v, v, v, null, stabilisation, measurement, dynamic, startUp, maxSlopes);
        }
        else
        {
            double power = p.Positive("rated_power_w", null, 10e6);
            var voltages = p.Map("mpp_voltage_v", ["min", "rated", "max"])
                ?? throw new ArenaInputException("missing required section 'mpp_voltage_v' in 'scenario.procedure': expected { min, rated, max } in volts", "mpp_voltage_v", p.Location);
            double min = voltages.Positive("min", null, 10_000), rated = voltages.Positive("rated", null, 10_000), max = voltages.Positive("max", null, 10_000);
            if (!(min <= rated && rated <= max)) throw voltages.Error(voltages.Node("rated")!, "expected min <= rated <= max MPP voltage", "mpp_voltage_v");
            settings = new ProcedureSettings(power, min, rated, max, shape, stabilisation, measurement, dynamic, startUp, maxSlopes);
        }
        CheckPlant(plant, settings, p);
        return (plant, settings);
    }

    private static bool Flag(YamlMap p, string key)
    {
        if (p.Node(key) is not { } n) return true;
        string text = p.Scalar(n, key, "true or false");
        return text switch
        {
            "true" => true,
            "false" => false,
            _ => throw p.Error(n, $"'{key}' = '{text}' is not valid: expected true or false", key),
        };
    }

    /// <summary>Refuses a plant that cannot run the procedure's test arrays, naming the fix (as the scenario loader does for its own array).</summary>
    private static void CheckPlant(Scenario plant, ProcedureSettings s, YamlMap p)
    {
        if (s.Shape is null) return;
        var c = CultureInfo.InvariantCulture;
        double voc = s.MaxMppVoltageV / s.Shape.MppToOpenCircuitVoltage;
        double isc = s.RatedPowerW / s.MinMppVoltageV / s.Shape.MppToShortCircuitCurrent;
        if (plant.Sensors.Voltage.FullScale < voc)
            throw new ArenaInputException(string.Format(c, "the voltage sensor's full scale {0:0.#} V is below the test array's open-circuit voltage at the maximum MPP voltage, {1:0.#} V; raise full_scale_v or lower mpp_voltage_v.max", plant.Sensors.Voltage.FullScale, voc), "mpp_voltage_v", p.Location);
        if (plant.Sensors.Current.FullScale < isc)
            throw new ArenaInputException(string.Format(c, "the current sensor's full scale {0:0.###} A is below the test array's short-circuit current at rated power and the minimum MPP voltage, {1:0.###} A; raise full_scale_a or lower rated_power_w", plant.Sensors.Current.FullScale, isc), "rated_power_w", p.Location);
        if (plant.Converter.Kind == FrontEndKind.Boost && plant.Converter.BusVoltageV <= s.MaxMppVoltageV)
            throw new ArenaInputException(string.Format(c, "the boost bus {0:0.#} V is not above the maximum MPP voltage {1:0.#} V: a boost cannot hold its input above its output", plant.Converter.BusVoltageV, s.MaxMppVoltageV), "mpp_voltage_v", p.Location);
        if (plant.Converter.Kind == FrontEndKind.Buck && plant.Converter.BatteryVoltageV >= s.MinMppVoltageV)
            throw new ArenaInputException(string.Format(c, "the buck's battery {0:0.#} V is not below the minimum MPP voltage {1:0.#} V: a buck cannot hold its input below its output", plant.Converter.BatteryVoltageV, s.MinMppVoltageV), "mpp_voltage_v", p.Location);
    }
}
