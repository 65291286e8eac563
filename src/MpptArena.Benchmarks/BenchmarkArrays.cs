using MpptArena.Arrays;
using MpptArena.Pv;

using MpptArena.Sensing;

namespace MpptArena.Benchmarks;

/// <summary>The array the performance targets name: 2 strings x 10 modules x 3 substrings, every substring under its own irradiance.</summary>
internal static class BenchmarkArrays
{
    public static readonly ModuleModel Module = DeSotoDatasheetFit.Fit(new ModuleDatasheet(9.50, 38.2, 8.95, 31.0, 60, 0.0045, -0.135));

    public static PvArray TwoByTen() => new(Module, new ArrayLayout(3, 10, 2, BypassDiode.FromForwardVoltage(0.45, 10.0)));

    /// <summary>Every substring at a different irradiance between 150 and 1000 W/m2 (seeded), 40 degC.</summary>
    public static ArrayConditions AllDifferent(PvArray array, int seed = 7)
    {
        var c = array.UniformConditions(1000, 40);
        var random = new DeterministicRandom((ulong)seed);
        for (int k = 0; k < c.IrradianceWm2.Length; k++) c.IrradianceWm2[k] = 150 + 850 * random.NextDouble();
        return c;
    }
}
