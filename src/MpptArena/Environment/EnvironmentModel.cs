using MpptArena.Arrays;

namespace MpptArena.Environment;

/// <summary>Plane-of-array irradiance, temperature and shading over time, evaluated per substring.</summary>
/// <param name="Irradiance">Unshaded plane-of-array irradiance [W/m2].</param>
/// <param name="Temperature">Cell or ambient temperature.</param>
/// <param name="Shading">Shades, applied one after the other.</param>
public sealed record EnvironmentModel(PiecewiseLinearProfile Irradiance, TemperatureModel Temperature, IReadOnlyList<IShading> Shading)
{
    /// <summary>Writes every substring's irradiance and cell temperature at <paramref name="timeS"/> into <paramref name="target"/>.</summary>
    /// <param name="timeS">Simulation time [s].</param>
    /// <param name="target">Conditions to fill.</param>
    /// <param name="factors">Scratch array of the substring count (avoids allocating each call).</param>
    public void Evaluate(double timeS, ArrayConditions target, double[] factors)
    {
        double g = Math.Max(Irradiance.ValueAt(timeS), 0.0);
        double temperature = Temperature.Profile.ValueAt(timeS);
        Array.Fill(factors, 1.0);
        for (int s = 0; s < Shading.Count; s++) Shading[s].Apply(timeS, factors);
        for (int k = 0; k < factors.Length; k++)
        {
            double gk = g * factors[k];
            target.IrradianceWm2[k] = gk;
            target.CellTemperatureC[k] = Temperature.CellTemperatureFromProfileValue(temperature, gk);
        }
    }
}
