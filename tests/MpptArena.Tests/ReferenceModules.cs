using MpptArena.Arrays;
using MpptArena.Pv;

namespace MpptArena.Tests;

/// <summary>Datasheets and layouts used across the tests, each with where its numbers come from.</summary>
internal static class ReferenceModules
{
    /// <summary>
    /// The 54-cell multicrystalline module whose datasheet values are tabulated by M. G. Villalva,
    /// J. R. Gazoli, E. R. Filho, "Comprehensive approach to modeling and simulation of photovoltaic
    /// arrays", IEEE Trans. Power Electronics 24(5), 2009, Table I (values from memory: Isc 8.21 A,
    /// Voc 32.9 V, Imp 7.61 A, Vmp 26.3 V, Ki 3.18 mA/K, Kv -123 mV/K, 54 cells).
    /// </summary>
    public static readonly ModuleDatasheet Villalva54Cell = new(8.21, 32.9, 7.61, 26.3, 54, 0.0032, -0.1230);

    /// <summary>
    /// A 60-cell module of our own invention with typical mono-crystalline values (common practice
    /// range: Isc 9-10 A, Voc 37-40 V, FF about 0.78).
    /// </summary>
    public static readonly ModuleDatasheet Invented60Cell = new(9.50, 38.2, 9.00, 31.4, 60, 0.0045, -0.118);

    private static ModuleModel? _fitted60;

    /// <summary>The invented 60-cell module, fitted once per test run.</summary>
    public static ModuleModel Fitted60 => _fitted60 ??= DeSotoDatasheetFit.Fit(Invented60Cell);

    /// <summary>Schottky bypass diode: 0.45 V at 10 A (common practice: 0.4-0.5 V at module current).</summary>
    public static BypassDiode Schottky => BypassDiode.FromForwardVoltage(0.45, 10.0, 1.0);

    /// <summary>An array of the invented module.</summary>
    public static PvArray Array(int modulesPerString, int strings, BypassDiode? blocking = null) =>
        new(Fitted60, new ArrayLayout(3, modulesPerString, strings, Schottky, blocking));

    /// <summary>Every substring of <paramref name="array"/> at its own seeded irradiance in [150, 1000) W/m2, one temperature.</summary>
    public static ArrayConditions RandomShading(PvArray array, double temperatureC, int seed)
    {
        var c = array.UniformConditions(1000, temperatureC);
        var rng = new Random(seed);
        for (int k = 0; k < c.IrradianceWm2.Length; k++) c.IrradianceWm2[k] = 150 + 850 * rng.NextDouble();
        return c;
    }
}
