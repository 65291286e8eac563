using MpptArena.Arrays;
using MpptArena.Environment;
using MpptArena.Plant;
using MpptArena.Pv;
using MpptArena.Runs;
using MpptArena.Scoring;
using MpptArena.Sensing;
using MpptArena.Trackers;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// Reads a scenario file into a validated, immutable <see cref="Scenario"/>. Every error names the file,
/// line and column and what was expected; nothing is run before the whole file is valid.
/// The format is documented in README.md and in scenarios/scenario.schema.json.
/// </summary>
public static class ScenarioLoader
{
    /// <summary>Keys a scenario file may hold at its top level ('procedure' is read by the procedure command only).</summary>
    internal static readonly string[] TopKeys = ["name", "description", "module", "array", "converter", "sensors", "environment", "simulation", "trackers", "scoring", "plugins", "procedure"];
    private static readonly string[] PlantKeys = ["name", "description", "module", "array", "conditions"];
    private static readonly string[] EnvironmentKeys = ["irradiance_w_m2", "cell_temperature_c", "ambient_temperature_c", "noct_c", "shading"];

    /// <summary>Loads a scenario file.</summary>
    /// <param name="path">Path of the YAML file.</param>
    /// <param name="registry">Tracker kinds that may be named.</param>
    public static Scenario Load(string path, TrackerRegistry registry)
    {
        return Parse(YamlInput.ReadText(path, "scenario file"), path, registry, Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".");
    }

    /// <summary>
    /// Loads what the curve command needs from either a plant file (name, module, array, conditions) or a
    /// scenario file (its environment evaluated at <paramref name="atS"/>).
    /// </summary>
    public static (string Name, PvArray Array, ArrayConditions Conditions) LoadCurveSetup(string path, double atS)
    {
        string text = YamlInput.ReadText(path, "file");
        string dir = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        var top = ReadRoot(text, path);
        EnvironmentModel environment;
        YamlMap root;
        if (top is YamlMappingNode m && m.Children.Keys.OfType<YamlScalarNode>().Any(k => k.Value == "conditions"))
        {
            root = new YamlMap(top, path, "plant", PlantKeys);
            var module = ReadModule(Required(root, "module", ["datasheet", "single_diode"]));
            var array = ReadArray(Required(root, "array", ArrayKeys), module);
            environment = ReadEnvironment(Required(root, "conditions", EnvironmentKeys), array, path, dir, [], []).Model;
            return (ReadName(root), array, Evaluate(array, environment, atS));
        }
        var scenario = Parse(text, path, TrackerRegistry.WithBuiltIns(), dir);
        return (scenario.Name, scenario.Array, Evaluate(scenario.Array, scenario.Environment, atS));
    }

    private static ArrayConditions Evaluate(PvArray array, EnvironmentModel environment, double atS)
    {
        var c = array.UniformConditions(0, 25);
        environment.Evaluate(atS, c, new double[c.IrradianceWm2.Length]);
        return c;
    }

    private static readonly string[] ArrayKeys = ["substrings_per_module", "modules_per_string", "strings", "bypass_diode", "blocking_diode"];

    private static string ReadName(YamlMap root)
    {
        string name = root.Text("name");
        if (!FileSafeName.IsValid(name, dots: false))
        {
            throw root.Error(root.Node("name")!, $"'name' = '{FileSafeName.Shown(name)}' must be 1 to {FileSafeName.MaxLength} letters, digits, '-' and '_' (it names the results folder)", "name");
        }
        return name;
    }

    private static YamlNode ReadRoot(string yaml, string file) => YamlInput.ReadRoot(yaml, file, "a scenario mapping");

    /// <summary>Parses scenario text; <paramref name="file"/> is used in messages.</summary>
    public static Scenario Parse(string yaml, string file, TrackerRegistry registry, string baseDirectory = ".")
    {
        var root = new YamlMap(ReadRoot(yaml, file), file, "scenario", TopKeys);
        if (root.Sequence("plugins") is { } plugins)
        {
            registry = registry.Clone();
            foreach (var p in plugins.Children)
            {
                string rel = root.Scalar(p, "plugins", "a path to a .NET assembly");
                string full = Path.IsPathRooted(rel) ? rel : Path.Combine(baseDirectory, rel);
                try
                {
                    TrackerPluginLoader.LoadInto(registry, full);
                }
                catch (ArenaInputException ex)
                {
                    throw new ArenaInputException(ex.Reason, "plugins", root.Where(p));
                }
            }
        }
        return ParseRoot(root, file, registry, baseDirectory);
    }

    private static Scenario ParseRoot(YamlMap root, string file, TrackerRegistry registry, string baseDirectory)
    {
        string name = ReadName(root);
        string description = root.Text("description", "");
        var moduleMap = Required(root, "module", ["datasheet", "single_diode"]);
        var module = ReadModule(moduleMap);
        var warnings = new List<string>();
        if (IdealityWarning(module) is { } w) warnings.Add($"{moduleMap.Location}: {w}");
        var array = ReadArray(Required(root, "array", ArrayKeys), module);
        var sensors = ReadSensors(Required(root, "sensors", SensorKeys));
        var converter = ReadConverter(Required(root, "converter", ConverterKeys), sensors);
        CheckPlant(root, array, converter, sensors);
        var windows = new List<ScoringWindow>();
        var sources = new List<string> { $"scenario {root.Digest}" };
        var (environment, profiles) = ReadEnvironment(Required(root, "environment", EnvironmentKeys),
            array, file, baseDirectory, windows, sources);
        var simulationMap = Required(root, "simulation", ["duration_s", "plant_step_us", "environment_step_ms", "seed", "seeds", "reprepare_irradiance_w_m2", "reprepare_temperature_c", "series_interval_ms"]);
        var simulation = ReadSimulation(simulationMap, environment, converter.Kind);
        profiles.CheckCovers(simulation.DurationS);
        var trackers = ReadTrackers(root, registry, simulationMap.Has("plant_step_us") ? simulation : null, baseDirectory, converter);
        simulation = (simulation with { PlantStepGiven = simulationMap.Has("plant_step_us"), EnvironmentStepGiven = simulationMap.Has("environment_step_ms") })
            .WithStepsFor(converter.Kind, trackers.Select(t => t.SamplePeriodS));
        var scoring = ReadScoring(root.Map("scoring", ["settling_band_fraction", "settling_hold_s", "static_allowance_s", "windows", "curve_snapshots_s", "stall_fraction"]), windows, simulation);
        return new Scenario(name, description, array, converter, sensors, environment, simulation, trackers, scoring) { InputDigest = ContentDigest.OfParts(sources), Warnings = warnings };
    }

    private static YamlMap Required(YamlMap parent, string key, IReadOnlyCollection<string> allowed) =>
        parent.Map(key, allowed) ?? throw new ArenaInputException($"missing required section '{key}' in '{parent.Path}'", key, parent.Location);

    /// <summary>Lowest and highest ideality factor a crystalline-silicon cell has (Sah, Noyce, Shockley 1957: 1 diffusion, 2 recombination).</summary>
    public const double MinIdealityFactor = 1.0, MaxIdealityFactor = 2.0;

    /// <summary>A warning when the module's ideality factor is outside 1 to 2, naming what to check; null otherwise.</summary>
    public static string? IdealityWarning(ModuleModel module)
    {
        double n = module.IdealityFactor;
        if (n >= MinIdealityFactor * (1 - 1e-9) && n <= MaxIdealityFactor) return null;
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        string direction = n < MinIdealityFactor ? "below the physical lower limit of 1" : "above the 2 of recombination-dominated cells";
        string fix = n < MinIdealityFactor
            ? "a more negative Voc temperature coefficient or a lower fill factor (MPP voltage or current) fits higher"
            : "a less negative Voc temperature coefficient or a higher fill factor fits lower";
        return string.Format(inv, "the module fits to an ideality factor of {0:0.000} per cell, {1}; the curve at STC is right but its change with temperature and irradiance is not physical: check the datasheet ({2})", n, direction, fix);
    }

    private static ModuleModel ReadModule(YamlMap m)
    {
        if (m.Has("datasheet") == m.Has("single_diode"))
        {
            throw new ArenaInputException("'module' needs exactly one of 'datasheet' (fitted by the De Soto 2006 method) or 'single_diode' (the five parameters at STC)", "module", m.Location);
        }
        if (m.Map("datasheet", ["short_circuit_current_a", "open_circuit_voltage_v", "mpp_current_a", "mpp_voltage_v", "cells_in_series",
                "isc_temperature_coefficient_a_per_k", "voc_temperature_coefficient_v_per_k"]) is { } d)
        {
            var sheet = new ModuleDatasheet(d.Positive("short_circuit_current_a"), d.Positive("open_circuit_voltage_v"), d.Positive("mpp_current_a"),
                d.Positive("mpp_voltage_v"), d.Integer("cells_in_series", null, 1, 1000), d.Number("isc_temperature_coefficient_a_per_k", null, -1, 1),
                d.Number("voc_temperature_coefficient_v_per_k", null, -10, 10));
            try
            {
                return DeSotoDatasheetFit.Fit(sheet);
            }
            catch (ArenaInputException ex)
            {
                var at = ex.Field is not null && d.Node(ex.Field) is { } n ? d.Where(n) : d.Location;
                throw new ArenaInputException(ex.Reason, ex.Field, at);
            }
        }
        var s = m.Map("single_diode", ["photocurrent_a", "saturation_current_a", "modified_ideality_v", "series_resistance_ohm", "shunt_resistance_ohm",
            "cells_in_series", "isc_temperature_coefficient_a_per_k"])!;
        var p = SingleDiodeParameters.FromShuntResistance(s.Positive("photocurrent_a"), s.Positive("saturation_current_a"), s.Positive("modified_ideality_v"),
            s.Number("series_resistance_ohm", null, 0, 1e3), s.Positive("shunt_resistance_ohm"));
        return new ModuleModel(p, s.Integer("cells_in_series", null, 1, 1000), s.Number("isc_temperature_coefficient_a_per_k", 0, -1, 1));
    }

    private static BypassDiode ReadDiode(YamlMap d) =>
        BypassDiode.FromForwardVoltage(d.Number("forward_voltage_v", null, 0.05, 2, true), d.Positive("at_current_a", null, MaxCurrentA), d.Number("ideality", 1.0, 0.5, 3),
            d.Text("material", "schottky", ["schottky", "silicon"]) == "silicon" ? DiodeMaterial.Silicon : DiodeMaterial.Schottky);

    private static PvArray ReadArray(YamlMap a, ModuleModel module)
    {
        int perModule = a.Integer("substrings_per_module", 3, 1, 100);
        if (module.CellsInSeries % perModule != 0)
        {
            throw a.Error(a.Node("substrings_per_module") ?? a.Node("array") ?? a.Required("substrings_per_module", "a divisor of cells_in_series"),
                $"'substrings_per_module' = {perModule} does not divide the module's {module.CellsInSeries} cells evenly", "substrings_per_module");
        }
        string[] diodeKeys = ["forward_voltage_v", "at_current_a", "ideality", "material"];
        var bypass = a.Map("bypass_diode", diodeKeys) is { } b ? ReadDiode(b) : BypassDiode.FromForwardVoltage(0.45, 10.0);
        var blocking = a.Map("blocking_diode", diodeKeys) is { } k ? ReadDiode(k) : null;
        var layout = new ArrayLayout(perModule, a.Integer("modules_per_string", null, 1, 1000), a.Integer("strings", 1, 1, 1000), bypass, blocking);
        return new PvArray(module, layout);
    }

    private static AdcChannelSettings ReadAdc(YamlMap c, string unit)
    {
        double fullScale = c.Positive($"full_scale_{unit}", null, unit == "v" ? MaxVoltageV : MaxCurrentA);
        return new AdcChannelSettings(c.Integer("bits", 12, 4, 24), fullScale, c.Number("gain_error", 0, -0.5, 0.5),
            c.Number($"offset_{unit}", 0, -fullScale, fullScale), c.Number($"noise_rms_{unit}", 0, 0, fullScale), c.Integer("averaging_samples", 1, 1, 10_000),
            c.Number("averaging_window_us", 0, 0, 1e7) * 1e-6);
    }

    private static readonly string[] VoltageSensorKeys = ["bits", "gain_error", "averaging_samples", "averaging_window_us", "full_scale_v", "offset_v", "noise_rms_v"];
    private static readonly string[] CurrentSensorKeys = ["bits", "gain_error", "averaging_samples", "averaging_window_us", "full_scale_a", "offset_a", "noise_rms_a", "measures"];

    private static readonly string[] SensorKeys = ["voltage", "current", "ripple"];

    private static SensorSettings ReadSensors(YamlMap s)
    {
        var v = s.Map("voltage", VoltageSensorKeys) ?? throw new ArenaInputException("missing required section 'voltage' in 'scenario.sensors'", "voltage", s.Location);
        var i = s.Map("current", CurrentSensorKeys) ?? throw new ArenaInputException("missing required section 'current' in 'scenario.sensors'", "current", s.Location);
        var measures = i.Text("measures", "pv", ["pv", "inductor"]) == "inductor" ? CurrentSignal.InductorCurrent : CurrentSignal.PvCurrent;
        RippleSettings? ripple = null;
        if (s.Map("ripple", ["trigger", "phase"]) is { } r)
        {
            bool carrier = r.Text("trigger", "carrier", ["carrier", "free_running"]) == "carrier";
            if (!carrier && r.Has("phase")) throw r.Error(r.Node("phase")!, "'phase' goes with 'trigger: carrier'; a free-running ADC converts at every phase", "phase");
            ripple = new RippleSettings(carrier, r.Number("phase", 0.5, 0, 1));
            if (ripple.PhaseFraction >= 1) throw r.Error(r.Node("phase")!, "'phase' must be below 1 (a fraction of the switching period, 0 = switch on)", "phase");
        }
        return new SensorSettings(ReadAdc(v, "v"), ReadAdc(i, "a"), measures, ripple);
    }

    /// <summary>Highest voltage any scenario value may name [V]: well above the 1500 V DC of the largest PV systems.</summary>
    private const double MaxVoltageV = 10_000;

    /// <summary>Highest current any scenario value may name [A].</summary>
    private const double MaxCurrentA = 10_000;

    /// <summary>
    /// Refuses plants that cannot track at all, naming the fix: sensors that clip below the array's STC
    /// open-circuit voltage or short-circuit current, a boost whose bus is not above the STC MPP voltage
    /// (a boost only steps up), a buck whose battery is not below it (a buck only steps down).
    /// </summary>
    private static void CheckPlant(YamlMap root, PvArray array, ConverterSettings converter, SensorSettings sensors)
    {
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        var module = array.Module.Reference;
        int series = array.Layout.ModulesPerString;
        double voc = SingleDiodeModel.OpenCircuitVoltageV(module) * series;
        double isc = SingleDiodeModel.ShortCircuitCurrentA(module) * array.Layout.StringsInParallel;
        double vmp = SingleDiodeModel.MaximumPowerPoint(module).VoltageV * series;
        var sensorMap = root.Map("sensors", SensorKeys)!;
        var converterMap = root.Map("converter", ConverterKeys)!;
        if (sensors.Voltage.FullScale < voc)
        {
            var m = sensorMap.Map("voltage", VoltageSensorKeys)!;
            throw m.Error(m.Node("full_scale_v")!, string.Format(inv, "the voltage sensor's full scale {0:0.#} V is below the array's open-circuit voltage at STC, {1:0.#} V: readings above it clip and no tracker can see the curve; set full_scale_v to at least {1:0.#} V (cold cells go higher)", sensors.Voltage.FullScale, voc), "full_scale_v");
        }
        if (sensors.Current.FullScale < isc)
        {
            var m = sensorMap.Map("current", CurrentSensorKeys)!;
            throw m.Error(m.Node("full_scale_a")!, string.Format(inv, "the current sensor's full scale {0:0.###} A is below the array's short-circuit current at STC, {1:0.###} A: readings above it clip; set full_scale_a to at least {1:0.###} A", sensors.Current.FullScale, isc), "full_scale_a");
        }
        if (converter.Kind == FrontEndKind.IdealSource && sensors.Ripple is not null)
        {
            throw sensorMap.Error(sensorMap.Node("ripple")!, "'ripple' needs a switching converter (boost or buck); the ideal source has no switching ripple", "ripple");
        }
        if (converter.Kind == FrontEndKind.IdealSource && sensors.CurrentMeasures == CurrentSignal.InductorCurrent)
        {
            var m = sensorMap.Map("current", CurrentSensorKeys)!;
            throw m.Error(m.Node("measures")!, "'measures: inductor' needs a switching converter (boost or buck); the ideal source has no inductor", "measures");
        }
        if (converter.Kind == FrontEndKind.Boost && converter.BusVoltageV <= vmp)
        {
            throw converterMap.Error(converterMap.Node("bus_voltage_v") ?? converterMap.Node("type")!, string.Format(inv, "the boost's bus, {0:0.#} V, is not above the array's MPP voltage at STC, {1:0.#} V: a boost can only hold the PV voltage below its bus; set bus_voltage_v above {2:0.#} V (the open-circuit voltage) or put fewer modules in a string", converter.BusVoltageV, vmp, voc), "bus_voltage_v");
        }
        if (converter.Kind == FrontEndKind.Buck && converter.BatteryVoltageV >= vmp)
        {
            throw converterMap.Error(converterMap.Node("battery_voltage_v") ?? converterMap.Node("type")!, string.Format(inv, "the buck's battery, {0:0.#} V, is not below the array's MPP voltage at STC, {1:0.#} V: a buck can only hold the PV voltage above its battery; put more modules in a string or choose a lower battery voltage", converter.BatteryVoltageV, vmp), "battery_voltage_v");
        }
    }

    private static readonly string[] ConverterKeys =
    [
        "type", "lag_time_constant_ms", "input_capacitance_uf", "inductance_mh", "inductor_resistance_ohm", "bus_voltage_v",
        "battery_voltage_v", "battery_resistance_ohm", "min_duty", "max_duty", "voltage_loop_bandwidth_hz", "current_loop_bandwidth_hz",
        "max_voltage_reference_v", "voltage_loop_integral_hz", "voltage_loop_rate_hz", "switching_frequency_khz",
    ];

    private static ConverterSettings ReadConverter(YamlMap c, SensorSettings sensors)
    {
        string type = c.Text("type", null, ["ideal_source", "boost", "buck"]);
        var kind = type switch { "boost" => FrontEndKind.Boost, "buck" => FrontEndKind.Buck, _ => FrontEndKind.IdealSource };
        var d = new ConverterSettings(kind);
        double minDuty = c.Number("min_duty", d.MinDuty, 0, 1), maxDuty = c.Number("max_duty", d.MaxDuty, 0, 1);
        if (maxDuty <= minDuty) throw c.Error(c.Node("max_duty") ?? c.Node("min_duty")!, "'max_duty' must be above 'min_duty'", "max_duty");
        return d with
        {
            // Upper bounds: far beyond any PV converter, so that a typo in the exponent is an error, not a run.
            LagTimeConstantS = c.Positive("lag_time_constant_ms", d.LagTimeConstantS * 1e3, 1e4) * 1e-3,
            InputCapacitanceF = c.Positive("input_capacitance_uf", d.InputCapacitanceF * 1e6, 1e6) * 1e-6,
            InductanceH = c.Positive("inductance_mh", d.InductanceH * 1e3, 1e4) * 1e-3,
            InductorResistanceOhm = c.Number("inductor_resistance_ohm", d.InductorResistanceOhm, 0, 1e3),
            BusVoltageV = c.Positive("bus_voltage_v", d.BusVoltageV, MaxVoltageV),
            BatteryVoltageV = c.Positive("battery_voltage_v", d.BatteryVoltageV, MaxVoltageV),
            BatteryResistanceOhm = c.Number("battery_resistance_ohm", d.BatteryResistanceOhm, 0, 1e3),
            MinDuty = minDuty,
            MaxDuty = maxDuty,
            VoltageLoopBandwidthHz = c.Positive("voltage_loop_bandwidth_hz", d.VoltageLoopBandwidthHz, 1e6),
            CurrentLoopBandwidthHz = c.Positive("current_loop_bandwidth_hz", d.CurrentLoopBandwidthHz, 1e7),
            MaxVoltageReferenceV = c.Positive("max_voltage_reference_v", sensors.Voltage.FullScale, MaxVoltageV),
            VoltageLoopIntegralHz = c.Number("voltage_loop_integral_hz", d.VoltageLoopIntegralHz, 0, 1e6),
            VoltageLoopRateHz = c.Number("voltage_loop_rate_hz", d.VoltageLoopRateHz, 0, 1e7),
            SwitchingFrequencyHz = c.Positive("switching_frequency_khz", d.SwitchingFrequencyHz * 1e-3, 1e4) * 1e3,
        };
    }

    private static (EnvironmentModel Model, ProfileReader Profiles) ReadEnvironment(YamlMap e, PvArray array, string file, string baseDir, List<ScoringWindow> windows, List<string> sources)
    {
        var reader = new ProfileReader(file, baseDir, windows, sources);
        e.Required("irradiance_w_m2", "a number or a list of segments");
        var irradiance = reader.Read(e, "irradiance_w_m2", 0, 2000, irradiance: true);
        TemperatureModel temperature;
        if (e.Has("cell_temperature_c") == e.Has("ambient_temperature_c"))
        {
            throw new ArenaInputException("'environment' needs exactly one of 'cell_temperature_c' or 'ambient_temperature_c' (with 'noct_c')", "cell_temperature_c", e.Location);
        }
        if (e.Has("cell_temperature_c"))
        {
            if (e.Has("noct_c")) throw e.Error(e.Node("noct_c")!, "'noct_c' goes with 'ambient_temperature_c', not with 'cell_temperature_c'", "noct_c");
            temperature = new TemperatureModel(reader.Read(e, "cell_temperature_c", -60, 120, false), null);
        }
        else
        {
            temperature = new TemperatureModel(reader.Read(e, "ambient_temperature_c", -60, 70, false), e.Number("noct_c", null, 25, 80));
        }
        var shading = e.Sequence("shading") is { } seq ? ShadingReader.Read(seq, e, array.Layout, reader) : [];
        return (new EnvironmentModel(irradiance, temperature, shading), reader);
    }

    private static SimulationSettings ReadSimulation(YamlMap s, EnvironmentModel environment, FrontEndKind frontEnd)
    {
        var d = new SimulationSettings(1);
        // Without duration_s the run lasts as long as the irradiance and temperature profiles.
        double profileEnd = Math.Max(environment.Irradiance.EndTimeS, environment.Temperature.Profile.EndTimeS);
        if (!s.Has("duration_s") && profileEnd <= 0)
        {
            throw new ArenaInputException("missing required key 'duration_s' in 'scenario.simulation' (the profiles are constant, so they give no length): expected a number greater than zero", "duration_s", s.Location);
        }
        double duration = s.Positive("duration_s", profileEnd);
        // Without plant_step_us the step is chosen once the tracker periods are known (SimulationSettings.DefaultPlantStepS);
        // until then the front end's largest default stands in for the checks below.
        double step = s.Number("plant_step_us", SimulationSettings.DefaultPlantStepS(frontEnd, []) * 1e6, 1, 10_000) * 1e-6;
        double env = s.Number("environment_step_ms", d.EnvironmentStepS * 1e3, 0.001, 10_000) * 1e-3;
        if (s.Has("plant_step_us") && env < step) throw s.Error(s.Node("environment_step_ms")!, "'environment_step_ms' must not be shorter than the plant step", "environment_step_ms");
        if (duration / step > 2e9) throw s.Error(s.Node("duration_s")!, "duration_s / plant_step is over 2e9 steps; use a longer plant step", "duration_s");
        string seedText = s.Has("seed") ? s.Scalar(s.Node("seed")!, "seed") : "1";
        if (!ulong.TryParse(seedText, out ulong seed)) throw s.Error(s.Node("seed")!, $"'seed' = '{seedText}' must be a whole number from 0 to 18446744073709551615", "seed");
        return new SimulationSettings(duration, step, env, seed, s.Positive("reprepare_irradiance_w_m2", d.ReprepareIrradianceWm2),
            s.Positive("reprepare_temperature_c", d.ReprepareTemperatureC), s.Number("series_interval_ms", d.SeriesIntervalS * 1e3, 0, ProfileReader.MaxSegmentS * 1e3) * 1e-3)
        {
            Seeds = ReadSeeds(s, seed),
        };
    }

    /// <summary>
    /// 'seeds': a count N (the seeds 'seed', 'seed' + 1, ... 'seed' + N - 1) or a list of distinct seeds; null
    /// when absent, which is one run with 'seed'. A list replaces 'seed', so the two are not given together.
    /// </summary>
    private static IReadOnlyList<ulong>? ReadSeeds(YamlMap s, ulong seed)
    {
        if (s.Node("seeds") is not { } node) return null;
        if (node is YamlDotNet.RepresentationModel.YamlSequenceNode list)
        {
            if (s.Has("seed")) throw s.Error(node, "give either 'seed' or a list of 'seeds', not both (a count of 'seeds' starts at 'seed')", "seeds");
            var seeds = new List<ulong>();
            foreach (var item in list.Children)
            {
                string text = s.Scalar(item, "seeds", "a whole number from 0 to 18446744073709551615");
                if (!ulong.TryParse(text, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out ulong value))
                    throw s.Error(item, $"'seeds' entry '{text}' must be a whole number from 0 to 18446744073709551615", "seeds");
                if (seeds.Contains(value)) throw s.Error(item, $"'seeds' names seed {value} twice; each seed is one draw of the noise and counts once", "seeds");
                seeds.Add(value);
            }
            if (seeds.Count == 0 || seeds.Count > SeedSet.MaxSeeds) throw s.Error(node, $"'seeds' must list 1 to {SeedSet.MaxSeeds} seeds", "seeds");
            return seeds;
        }
        int count = s.Integer("seeds", null, 1, SeedSet.MaxSeeds);
        return SeedSet.Consecutive(seed, count);
    }

    private static IReadOnlyList<TrackerSpec> ReadTrackers(YamlMap root, TrackerRegistry registry, SimulationSettings? givenStep, string baseDirectory, ConverterSettings converter)
    {
        var seq = root.Sequence("trackers") ?? throw new ArenaInputException("missing required list 'trackers' in 'scenario'", "trackers", root.Location);
        if (seq.Children.Count == 0) throw root.Error(seq, "'trackers' is empty: name at least one tracker", "trackers");
        var specs = new List<TrackerSpec>();
        int index = 0;
        foreach (var item in seq.Children)
        {
            var t = new YamlMap(item, root.File, $"scenario.trackers[{index++}]", ["name", "period_ms", "parameters", .. TrackerEntryReader.Keys]);
            var (descriptor, limits) = TrackerEntryReader.Read(t, baseDirectory, registry);
            string kind = t.Text("type");
            string name = TrackerEntryReader.ReadName(t, kind);
            if (specs.Any(s => s.Name == name)) throw t.Error(t.Node("name") ?? item, $"tracker name '{name}' is used twice; names must be unique", "name");
            double periodS = t.Number("period_ms", 10, 0.001, 3_600_000) * 1e-3;
            if (givenStep is { } sim && !SimulationSettings.IsWholeNumberOfSteps(periodS, sim.PlantStepS))
            {
                throw t.Error(t.Node("period_ms")!, $"'period_ms' = {periodS * 1e3:0.###} is not a whole number of plant steps ({sim.PlantStepS * 1e6:0.###} us); make it a multiple of simulation.plant_step_us, or leave plant_step_us out to have a step chosen", "period_ms");
            }
            var given = new Dictionary<string, double>(StringComparer.Ordinal);
            var pm = t.Has("parameters") ? new YamlMap(t.Node("parameters")!, root.File, $"{t.Path}.parameters", descriptor.Parameters.Select(p => p.Name).ToArray()) : null;
            if (pm is not null)
            {
                foreach (var p in descriptor.Parameters)
                {
                    if (pm.Has(p.Name)) given[p.Name] = pm.Number(p.Name, null, p.Min, p.Max);
                }
            }
            var settings = new TrackerSettings(descriptor.Parameters, given);
            TrackerEntryReader.CheckCommandKind(t, descriptor, settings, converter);
            specs.Add(new TrackerSpec(name, descriptor, settings, periodS) { Limits = limits });
        }
        return specs;
    }

    private static ScoringSettings ReadScoring(YamlMap? s, List<ScoringWindow> windows, SimulationSettings sim)
    {
        var d = new ScoringSettings();
        if (s is null) return d with { Windows = windows };
        if (s.Sequence("windows") is { } seq)
        {
            int k = 0;
            foreach (var item in seq.Children)
            {
                var w = new YamlMap(item, s.File, $"{s.Path}.windows[{k++}]", ["name", "start_s", "end_s"]);
                string name = w.Text("name");
                if (!FileSafeName.IsValid(name, dots: true, leadingDot: true))
                {
                    throw w.Error(w.Node("name")!, $"window name '{FileSafeName.Shown(name)}' must be 1 to {FileSafeName.MaxLength} letters, digits, '-', '_' or '.' (it names the score window:NAME)", "name");
                }
                if (windows.Any(x => x.Name == name || x.Group == name)) throw w.Error(w.Node("name")!, $"window name '{name}' is used twice", "name");
                double start = w.Number("start_s", null, 0, ProfileReader.MaxSegmentS), end = w.Number("end_s", null, 0, ProfileReader.MaxSegmentS);
                if (end <= start) throw w.Error(w.Node("end_s")!, "'end_s' must be after 'start_s'", "end_s");
                if (start >= sim.DurationS) throw w.Error(w.Node("start_s")!, $"window starts at {start} s, after the run ends ({sim.DurationS} s)", "start_s");
                if (end > sim.DurationS * (1 + 1e-12)) throw w.Error(w.Node("end_s")!, $"window ends at {end} s, after the run ends ({sim.DurationS} s); a window is scored over time the run covers", "end_s");
                windows.Add(new ScoringWindow(name, start, end));
            }
        }
        var snapshots = new List<double>();
        if (s.Sequence("curve_snapshots_s") is { } snaps)
        {
            foreach (var n in snaps.Children)
            {
                double t = s.ParseNumber(n, "curve_snapshots_s", "a time in seconds");
                if (t < 0 || t > sim.DurationS) throw s.Error(n, $"snapshot time {t} s is outside the run (0 to {sim.DurationS} s)", "curve_snapshots_s");
                snapshots.Add(t);
            }
        }
        return new ScoringSettings(s.Number("settling_band_fraction", d.SettlingBandFraction, 0, 1, true), s.Number("settling_hold_s", d.SettlingHoldS, 0, ProfileReader.MaxSegmentS),
            s.Number("static_allowance_s", d.StaticAllowanceS, 0, ProfileReader.MaxSegmentS), windows, snapshots,
            s.Number("stall_fraction", d.StallFraction, 0, 1, true));
    }
}
