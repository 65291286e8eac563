using MpptArena.Plant;

namespace MpptArena.Runs;

/// <summary>Time stepping of a run.</summary>
/// <param name="DurationS">Simulated time [s].</param>
/// <param name="PlantStepS">Plant integration step [s]; scenarios that leave it out get <see cref="DefaultPlantStepS"/>.</param>
/// <param name="EnvironmentStepS">Interval at which irradiance, temperature and shading are re-evaluated [s]; held in between.</param>
/// <param name="Seed">Seed of all random streams (sensor noise) [-].</param>
/// <param name="ReprepareIrradianceWm2">Largest irradiance difference between the prepared curve and any substring [W/m2] (conditions are rounded to a grid of twice this; see <see cref="Plant.ArrayCurveCache"/>).</param>
/// <param name="ReprepareTemperatureC">Largest temperature difference between the prepared curve and any substring [K] (grid of twice this).</param>
/// <param name="SeriesIntervalS">Time series row interval [s]; zero for every plant step.</param>
public sealed record SimulationSettings(
    double DurationS,
    double PlantStepS = 200e-6,
    double EnvironmentStepS = 1e-3,
    ulong Seed = 1,
    double ReprepareIrradianceWm2 = 1.0,
    double ReprepareTemperatureC = 0.2,
    double SeriesIntervalS = 0.01)
{
    /// <summary>True when the scenario set the plant step; false when it is chosen for the trackers' periods (<see cref="WithStepsFor"/>).</summary>
    public bool PlantStepGiven { get; init; } = true;

    /// <summary>
    /// Seeds to run the scenario with, each one draw of the sensor noise; null for one run with <see cref="Seed"/>.
    /// Scores over several seeds are reported as their mean, spread and confidence interval.
    /// </summary>
    public IReadOnlyList<ulong>? Seeds { get; init; }

    /// <summary>The seeds a run uses: <see cref="Seeds"/>, or <see cref="Seed"/> alone.</summary>
    public IReadOnlyList<ulong> SeedList => Seeds ?? [Seed];

    /// <summary>True when the scenario is scored over more than one seed.</summary>
    public bool IsMultiSeed => SeedList.Count > 1;

    /// <summary>True when the scenario set the environment step; false when it follows the plant step.</summary>
    public bool EnvironmentStepGiven { get; init; } = true;

    /// <summary>
    /// These settings with the plant step chosen for trackers of the given periods when the scenario left it
    /// out: a step that divides every period (and the environment step when one is given); without one the
    /// environment is evaluated every plant step, but at least every millisecond. Unchanged when the step was given.
    /// </summary>
    public SimulationSettings WithStepsFor(FrontEndKind frontEnd, IEnumerable<double> samplePeriodsS)
    {
        if (PlantStepGiven) return this;
        var periods = EnvironmentStepGiven ? samplePeriodsS.Append(EnvironmentStepS) : samplePeriodsS;
        double step = DefaultPlantStepS(frontEnd, periods);
        return this with { PlantStepS = step, EnvironmentStepS = EnvironmentStepGiven ? EnvironmentStepS : Math.Max(1e-3, step) };
    }

    /// <summary>
    /// Largest default step [s] per front end: 10 ms for the ideal source (its lag is integrated exactly
    /// and its energy by Gauss-Legendre quadrature along the exact trajectory, so a step may be a whole
    /// tracker period), 1 ms for the boost (exponential closed-loop steps), 200 us for the buck (classical
    /// RK4 carries its loops). The convergence tests show that halving these steps changes run energy by
    /// far less than 0.1 %.
    /// </summary>
    public static double LargestDefaultStepS(FrontEndKind frontEnd) => frontEnd switch
    {
        FrontEndKind.Buck => 200e-6,
        FrontEndKind.IdealSource => 10e-3,
        _ => 1e-3,
    };

    /// <summary>
    /// The default plant step [s]: the largest step no longer than <see cref="LargestDefaultStepS"/> that
    /// divides every tracker period (their greatest common divisor, split into equal parts).
    /// </summary>
    public static double DefaultPlantStepS(FrontEndKind frontEnd, IEnumerable<double> samplePeriodsS)
    {
        double largest = LargestDefaultStepS(frontEnd);
        long gcdNs = 0;
        foreach (double period in samplePeriodsS) gcdNs = Gcd(gcdNs, Math.Max(1, (long)Math.Round(period * 1e9)));
        if (gcdNs == 0) return largest;
        double gcdS = gcdNs * 1e-9;
        return gcdS / Math.Ceiling(gcdS / largest * (1 - 1e-12));
    }

    /// <summary>True when <paramref name="periodS"/> is a whole number (at least one) of steps <paramref name="stepS"/>.</summary>
    public static bool IsWholeNumberOfSteps(double periodS, double stepS)
    {
        double ratio = periodS / stepS;
        return ratio >= 1 - 1e-9 && Math.Abs(ratio - Math.Round(ratio)) <= 1e-6 * ratio;
    }

    private static long Gcd(long a, long b)
    {
        while (b != 0) (a, b) = (b, a % b);
        return a;
    }
}
