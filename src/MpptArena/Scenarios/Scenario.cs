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
    /// <summary>
    /// Digest of everything in the scenario's own inputs that determines a result: the scenario document as
    /// loaded and the bytes of every CSV profile it reads (<see cref="ContentDigest"/>). Tracker code has its
    /// own digest (<see cref="Trackers.TrackerDescriptor.CodeDigest"/>).
    /// </summary>
    public string InputDigest { get; init; } = "";

    /// <summary>What the scenario allows but a practitioner should look at, each with its file position (e.g. a datasheet that fits to an unphysical ideality factor).</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

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
