namespace MpptArena.Runs;

/// <summary>Time stepping of a run.</summary>
/// <param name="DurationS">Simulated time [s].</param>
/// <param name="PlantStepS">Plant integration step [s].</param>
/// <param name="EnvironmentStepS">Interval at which irradiance, temperature and shading are re-evaluated [s]; held in between.</param>
/// <param name="Seed">Seed of all random streams (sensor noise) [-].</param>
/// <param name="ReprepareIrradianceWm2">Re-prepare the array curve when any substring's irradiance has moved this far [W/m2].</param>
/// <param name="ReprepareTemperatureC">Re-prepare the array curve when any substring's temperature has moved this far [K].</param>
/// <param name="SeriesIntervalS">Time series row interval [s]; zero for every plant step.</param>
public sealed record SimulationSettings(
    double DurationS,
    double PlantStepS = 200e-6,
    double EnvironmentStepS = 1e-3,
    ulong Seed = 1,
    double ReprepareIrradianceWm2 = 1.0,
    double ReprepareTemperatureC = 0.2,
    double SeriesIntervalS = 0.01);
