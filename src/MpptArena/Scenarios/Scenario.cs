using MpptArena.Arrays;
using MpptArena.Environment;
using MpptArena.Plant;
using MpptArena.Runs;
using MpptArena.Scoring;
using MpptArena.Sensing;

namespace MpptArena.Scenarios;

/// <summary>A complete, validated, immutable experiment: plant, environment, trackers, scoring, time stepping.</summary>
/// <param name="Name">Scenario name (file-name safe).</param>
/// <param name="Description">What the scenario shows.</param>
/// <param name="Array">The PV array.</param>
/// <param name="Converter">Converter front end.</param>
/// <param name="Sensors">ADC channels.</param>
/// <param name="Environment">Irradiance, temperature, shading over time.</param>
/// <param name="Simulation">Time stepping and seed.</param>
/// <param name="Trackers">Trackers to run.</param>
/// <param name="Scoring">Scoring settings.</param>
public sealed record Scenario(
    string Name,
    string Description,
    PvArray Array,
    ConverterSettings Converter,
    SensorSettings Sensors,
    EnvironmentModel Environment,
    SimulationSettings Simulation,
    IReadOnlyList<TrackerSpec> Trackers,
    ScoringSettings Scoring)
{
    /// <summary>Array open-circuit voltage at STC [V], as firmware would be configured.</summary>
    public double NominalOpenCircuitVoltageV
    {
        get
        {
            double vocModule = Pv.SingleDiodeModel.OpenCircuitVoltageV(Array.Module.Reference);
            return vocModule * Array.Layout.ModulesPerString;
        }
    }

    /// <summary>Array short-circuit current at STC [A].</summary>
    public double NominalShortCircuitCurrentA =>
        Pv.SingleDiodeModel.ShortCircuitCurrentA(Array.Module.Reference) * Array.Layout.StringsInParallel;
}
