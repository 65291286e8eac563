using System.Globalization;
using System.Text;
using MpptArena.Arrays;
using MpptArena.Cli.Terminal;
using MpptArena.Plant;
using MpptArena.Pv;
using MpptArena.Runs;
using MpptArena.Scenarios;
using MpptArena.Sensing;
using MpptArena.Trackers;

namespace MpptArena.Cli.Commands;

/// <summary>
/// mppt-arena explain SCENARIO.yaml: the scenario as the arena will run it, every default filled in, with the
/// plant's derived numbers (fitted single-diode parameters, the array at STC, the converter's reachable PV
/// voltage window, sensor resolution, the plant step and where it came from).
/// </summary>
internal static class ExplainCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "explain", ["--plugin"], []);
        a.RequirePositional(1, "mppt-arena explain SCENARIO.yaml [--plugin DLL]...");
        var s = ScenarioLoader.Load(a.Positional[0], Plugins.Registry(a.Options("--plugin")));
        StandardOutput.Out.Write(Render(s));
        foreach (string w in s.Warnings) StandardOutput.Error.WriteLine($"warning: {w}");
        return ExitCodes.Ok;
    }

    /// <summary>The explanation as text (YAML-like, units in the keys).</summary>
    internal static string Render(Scenario s)
    {
        var c = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        void Line(int indent, string text) => sb.Append(' ', 2 * indent).Append(text).Append('\n');
        string N(double v) => v.ToString("G6", c);

        Line(0, $"name: {s.Name}");
        var m = s.Array.Module;
        var r = m.Reference;
        Line(0, "module:                      # single-diode parameters of the whole module at STC (fitted or given)");
        Line(1, $"photocurrent_a: {N(r.PhotocurrentA)}");
        Line(1, $"saturation_current_a: {N(r.SaturationCurrentA)}");
        Line(1, $"modified_ideality_v: {N(r.ModifiedIdealityV)}");
        Line(1, $"ideality_factor_per_cell: {N(m.IdealityFactor)}");
        Line(1, $"series_resistance_ohm: {N(r.SeriesResistanceOhm)}");
        Line(1, $"shunt_resistance_ohm: {N(1 / r.ShuntConductanceS)}");
        Line(1, $"cells_in_series: {m.CellsInSeries}");
        Line(1, $"isc_temperature_coefficient_a_per_k: {N(m.IscTemperatureCoefficientAPerK)}");
        var (vmpModule, impModule, pmpModule) = SingleDiodeModel.MaximumPowerPoint(r);
        Line(1, $"stc: {{ voc_v: {N(SingleDiodeModel.OpenCircuitVoltageV(r))}, isc_a: {N(SingleDiodeModel.ShortCircuitCurrentA(r))}, vmp_v: {N(vmpModule)}, imp_a: {N(impModule)}, pmp_w: {N(pmpModule)} }}");

        var layout = s.Array.Layout;
        Line(0, "array:");
        Line(1, $"substrings_per_module: {layout.SubstringsPerModule}");
        Line(1, $"modules_per_string: {layout.ModulesPerString}");
        Line(1, $"strings: {layout.StringsInParallel}");
        Line(1, $"bypass_diode: {Diode(layout.Bypass, c)}");
        Line(1, $"blocking_diode: {(layout.Blocking is { } b ? Diode(b, c) : "none")}");
        var exact = s.Array.Solve(s.Array.UniformConditions(1000, 25));
        var peaks = MppSearch.RefineOnExact(MppSearch.FindPeaks(new PreparedArrayCurve(exact)), exact);
        Line(1, $"stc: {{ voc_v: {N(exact.OpenCircuitVoltageV)}, isc_a: {N(exact.ShortCircuitCurrentA)}, vmp_v: {N(peaks.Global.VoltageV)}, imp_a: {N(peaks.Global.CurrentA)}, pmp_w: {N(peaks.Global.PowerW)} }}");

        var k = s.Converter;
        var frontEnd = ScenarioRunner.CreateFrontEnd(k);
        Line(0, "converter:");
        Line(1, $"type: {k.Kind switch { FrontEndKind.IdealSource => "ideal_source", FrontEndKind.Boost => "boost", _ => "buck" }}");
        if (k.Kind == FrontEndKind.IdealSource)
        {
            Line(1, $"lag_time_constant_ms: {N(k.LagTimeConstantS * 1e3)}");
        }
        else
        {
            Line(1, $"input_capacitance_uf: {N(k.InputCapacitanceF * 1e6)}");
            Line(1, $"inductance_mh: {N(k.InductanceH * 1e3)}");
            Line(1, $"inductor_resistance_ohm: {N(k.InductorResistanceOhm)}");
            if (k.Kind == FrontEndKind.Boost) Line(1, $"bus_voltage_v: {N(k.BusVoltageV)}");
            else Line(1, $"battery: {{ voltage_v: {N(k.BatteryVoltageV)}, resistance_ohm: {N(k.BatteryResistanceOhm)} }}");
            Line(1, $"duty: {{ min: {N(k.MinDuty)}, max: {N(k.MaxDuty)} }}");
            Line(1, $"voltage_loop: {{ bandwidth_hz: {N(k.VoltageLoopBandwidthHz)}, integral_hz: {N(k.VoltageLoopIntegralHz)}, rate_hz: {N(k.VoltageLoopRateHz)} }}");
            Line(1, $"current_loop_bandwidth_hz: {N(k.CurrentLoopBandwidthHz)}");
            Line(1, $"switching_frequency_khz: {N(k.SwitchingFrequencyHz * 1e-3)}");
            // CCM/DCM boundary where the average inductor current is half its ripple, at the STC MPP voltage
            // and the CCM steady duty (Erickson, Maksimovic 2001, ch. 5); the array current scales with irradiance.
            double vmp = peaks.Global.VoltageV, ts = 1 / k.SwitchingFrequencyHz;
            double boundaryInputA = k.Kind == FrontEndKind.Boost
                ? vmp * (1 - vmp / k.BusVoltageV) * ts / (2 * k.InductanceH)
                : (vmp - k.BatteryVoltageV) * (k.BatteryVoltageV / vmp) * ts / (2 * k.InductanceH) * (k.BatteryVoltageV / vmp);
            Line(1, $"discontinuous_below: {{ input_current_a: {N(Math.Max(boundaryInputA, 0))}, irradiance_w_m2: {N(Math.Max(boundaryInputA, 0) / peaks.Global.CurrentA * 1000)} }}   # at the STC MPP voltage");
            // Steady state of the ideal converter: boost V_pv = (1 - D) V_bus, buck V_pv = V_batt / D (Erickson, Maksimovic 2001, ch. 2).
            var (low, high) = k.Kind == FrontEndKind.Boost
                ? ((1 - k.MaxDuty) * k.BusVoltageV, (1 - k.MinDuty) * k.BusVoltageV)
                : (k.BatteryVoltageV / k.MaxDuty, k.MinDuty > 0 ? k.BatteryVoltageV / k.MinDuty : double.PositiveInfinity);
            Line(1, $"reachable_pv_voltage_v: {{ from: {N(low)}, to: {(double.IsInfinity(high) ? "open circuit" : N(high))} }}   # steady state over the duty range");
        }
        var (vrefMin, vrefMax) = frontEnd.CommandRange(TrackerCommandKind.VoltageReference);
        Line(1, $"voltage_reference_v: {{ from: {N(vrefMin)}, to: {N(vrefMax)} }}");

        Line(0, "sensors:");
        Line(1, $"voltage: {Adc(s.Sensors.Voltage, "v", c)}");
        Line(1, $"current: {Adc(s.Sensors.Current, "a", c)}");
        Line(1, $"current_measures: {(s.Sensors.CurrentMeasures == Sensing.CurrentSignal.InductorCurrent ? "inductor" : "pv")}");
        Line(1, $"ripple: {(s.Sensors.Ripple is not { } ripple ? "none   # conversions see period means" : ripple.CarrierTriggered ? $"{{ trigger: carrier, phase: {N(ripple.PhaseFraction)} }}" : "{ trigger: free_running }")}");

        var sim = s.Simulation;
        Line(0, "simulation:");
        Line(1, $"duration_s: {N(sim.DurationS)}");
        Line(1, $"plant_step_us: {N(sim.PlantStepS * 1e6)}   # {(sim.PlantStepGiven ? "given" : $"chosen: the largest step up to {N(SimulationSettings.LargestDefaultStepS(k.Kind) * 1e6)} us that divides every tracker period")}");
        Line(1, $"environment_step_ms: {N(sim.EnvironmentStepS * 1e3)}   # {(sim.EnvironmentStepGiven ? "given" : "the plant step, at least 1 ms")}");
        Line(1, $"seed: {sim.Seed}");
        Line(1, $"series_interval_ms: {N(sim.SeriesIntervalS * 1e3)}");
        Line(1, $"reprepare: {{ irradiance_w_m2: {N(sim.ReprepareIrradianceWm2)}, temperature_c: {N(sim.ReprepareTemperatureC)} }}");

        Line(0, "trackers:");
        foreach (var t in s.Trackers)
        {
            string parameters = string.Join(", ", t.Settings.All.Select(p => $"{p.Key}: {N(p.Value)}"));
            Line(1, $"- {{ name: {t.Name}, type: {t.Descriptor.Kind}, period_ms: {N(t.SamplePeriodS * 1e3)}, runs: {(t.Descriptor.Isolation == Trackers.Isolation.IsolationMode.Process ? "in a host process" : "in process")}, parameters: {{ {parameters} }} }}");
        }

        var sc = s.Scoring;
        Line(0, "scoring:");
        Line(1, $"settling_band_fraction: {N(sc.SettlingBandFraction)}");
        Line(1, $"settling_hold_s: {N(sc.SettlingHoldS)}");
        Line(1, $"static_allowance_s: {N(sc.StaticAllowanceS)}");
        Line(1, $"windows: [{string.Join(", ", sc.AllWindows.Select(w => $"{w.Name} {N(w.StartS)}-{N(w.EndS)} s"))}]");
        return sb.ToString();
    }

    private static string Diode(BypassDiode d, CultureInfo c) =>
        string.Create(c, $"{{ saturation_current_a_at_25_c: {d.SaturationCurrentA:G6}, ideality: {d.IdealityFactor:G6}, material: {d.Material.ToString().ToLowerInvariant()} }}");

    /// <summary>An ADC channel with its resolution: one LSB is full scale / 2^bits.</summary>
    private static string Adc(AdcChannelSettings a, string unit, CultureInfo c) =>
        string.Create(c, $"{{ bits: {a.Bits}, full_scale_{unit}: {a.FullScale:G6}, lsb_{unit}: {a.FullScale / Math.Pow(2, a.Bits):G6}, gain_error: {a.GainError:G6}, offset_{unit}: {a.Offset:G6}, noise_rms_{unit}: {a.NoiseRms:G6}, averaging_samples: {a.AveragingSamples}, averaging_window_us: {a.AveragingWindowS * 1e6:G6} }}");
}
