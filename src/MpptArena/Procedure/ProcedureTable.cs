namespace MpptArena.Procedure;

/// <summary>
/// Every number of the MPPT efficiency test procedure in one place: power levels, weights, test-array curve
/// shapes, default times and the start-up and shut-down ramp.
/// </summary>
/// <remarks>
/// The static and dynamic procedure and its test array follow EN 50530:2010 + A1:2013 (Overall efficiency of grid
/// connected photovoltaic inverters) and IEC 62891:2020 (MPPT efficiency of grid connected PV inverters); the
/// European and CEC weightings are the ones in general use for inverter efficiency. Every value below is recalled
/// from memory of those texts, not copied from them: levels and weights with good confidence, curve shapes within
/// about +-0.01, times and the start-up ramp with low confidence (hence settings with these as defaults). A result
/// computed with them is a pre-compliance estimate, never a certified test.
/// </remarks>
public static class ProcedureTable
{
    /// <summary>Static power levels, as fractions of rated DC power [-] (from memory).</summary>
    public static IReadOnlyList<double> StaticLevels { get; } = [0.05, 0.10, 0.20, 0.25, 0.30, 0.50, 0.75, 1.00];

    /// <summary>European-style weights by power level (from memory): 0.03, 0.06, 0.13, 0.10, 0.48, 0.20 at 5, 10, 20, 30, 50, 100 %.</summary>
    public static IReadOnlyList<(double Level, double Weight)> EuropeanWeights { get; } =
        [(0.05, 0.03), (0.10, 0.06), (0.20, 0.13), (0.30, 0.10), (0.50, 0.48), (1.00, 0.20)];

    /// <summary>CEC-style weights by power level (from memory): 0.04, 0.05, 0.12, 0.21, 0.53, 0.05 at 10, 20, 30, 50, 75, 100 %.</summary>
    public static IReadOnlyList<(double Level, double Weight)> CecWeights { get; } =
        [(0.10, 0.04), (0.20, 0.05), (0.30, 0.12), (0.50, 0.21), (0.75, 0.53), (1.00, 0.05)];

    /// <summary>Crystalline silicon test array: Vmpp/Voc 0.80, Impp/Isc 0.90 (from memory, +-0.01); cell Voc 0.62 V and
    /// temperature coefficients -0.32 %/K (Voc) and +0.05 %/K (Isc) are common practice for such cells.</summary>
    public static CurveShape CrystallineSilicon { get; } = new("crystalline_silicon", 0.80, 0.90, 0.62, -0.0032, 0.0005);

    /// <summary>Thin-film test array: Vmpp/Voc 0.72, Impp/Isc 0.80 (from memory, +-0.01); cell Voc 0.85 V and
    /// temperature coefficients -0.25 %/K and +0.04 %/K are common practice for thin-film cells.</summary>
    public static CurveShape ThinFilm { get; } = new("thin_film", 0.72, 0.80, 0.85, -0.0025, 0.0004);

    /// <summary>Default stabilisation time before each static measurement [s] (from memory, low confidence).</summary>
    public const double DefaultStabilisationS = 60;

    /// <summary>Default static measurement time [s] (from memory: "several minutes", low confidence).</summary>
    public const double DefaultMeasurementS = 600;

    /// <summary>Start-up and shut-down test: low and high level as fractions of 1000 W/m2, the slope and the dwell
    /// (from memory, low confidence: about 2 % to 10 % at about 0.1 W/m2/s).</summary>
    public static (double LowFraction, double HighFraction, double SlopeWm2PerS, double DwellS) StartUpShutDown { get; } = (0.02, 0.10, 0.1, 60);

    /// <summary>The shape of a name used in procedure files, or null.</summary>
    public static CurveShape? ShapeNamed(string name) => name switch
    {
        "crystalline_silicon" => CrystallineSilicon,
        "thin_film" => ThinFilm,
        _ => null,
    };
}
