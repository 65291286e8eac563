using MpptArena.Arrays;

namespace MpptArena.Environment;

/// <summary>Plane-of-array irradiance, temperature and shading over time, evaluated per substring.</summary>
/// <param name="Irradiance">Unshaded plane-of-array irradiance [W/m2].</param>
/// <param name="Temperature">Cell or ambient temperature.</param>
/// <param name="Shading">Shades, applied one after the other.</param>
public sealed record EnvironmentModel(PiecewiseLinearProfile Irradiance, TemperatureModel Temperature, IReadOnlyList<IShading> Shading)
{
    /// <summary>
    /// Writes every substring's irradiance and cell temperature at <paramref name="timeS"/> into
    /// <paramref name="target"/> and the shading factors into <paramref name="factors"/>; returns true if
    /// any irradiance or temperature written differs from what <paramref name="target"/> held before.
    /// </summary>
    /// <param name="timeS">Simulation time [s].</param>
    /// <param name="target">Conditions to overwrite.</param>
    /// <param name="factors">Shading transmittance of each substring [-], overwritten.</param>
    public bool Evaluate(double timeS, ArrayConditions target, double[] factors) => Evaluate(timeS, target, factors, new EnvironmentCursor());

    /// <summary>As <see cref="Evaluate(double, ArrayConditions, double[])"/>, reading the profiles from where <paramref name="cursor"/> left them.</summary>
    public bool Evaluate(double timeS, ArrayConditions target, double[] factors, EnvironmentCursor cursor)
    {
        double g = Math.Max(Irradiance.ValueAt(timeS, ref cursor.IrradianceSegment), 0.0);
        double temperature = Temperature.Profile.ValueAt(timeS, ref cursor.TemperatureSegment);
        if (Shading.Count == 0)
        {
            // Unshaded: every substring gets the same two values, and was written with one pair last time.
            double cellC = Temperature.CellTemperatureFromProfileValue(temperature, g);
            if (factors.Length == 0 || (factors[0] == 1.0 && target.IrradianceWm2[0] == g && target.CellTemperatureC[0] == cellC)) return false;
            Array.Fill(factors, 1.0);
            Array.Fill(target.IrradianceWm2, g);
            Array.Fill(target.CellTemperatureC, cellC);
            return true;
        }
        // A change of shade shows as a change of irradiance below (none under a dark sky, where it does not matter).
        Array.Fill(factors, 1.0);
        for (int s = 0; s < Shading.Count; s++) Shading[s].Apply(timeS, factors);
        bool changed = false;
        // Substrings under the same irradiance share one cell-temperature evaluation.
        double lastG = double.NaN, lastT = double.NaN;
        var irradiance = target.IrradianceWm2;
        var cellTemperature = target.CellTemperatureC;
        for (int k = 0; k < factors.Length; k++)
        {
            double gk = g * factors[k];
            if (gk != lastG)
            {
                lastG = gk;
                lastT = Temperature.CellTemperatureFromProfileValue(temperature, gk);
            }
            if (irradiance[k] != gk || cellTemperature[k] != lastT)
            {
                irradiance[k] = gk;
                cellTemperature[k] = lastT;
                changed = true;
            }
        }
        return changed;
    }

    /// <summary>The event a profile breakpoint in [from, to) [s] marks ("irradiance change" or "temperature change"), or null if there is none.</summary>
    public string? ProfileBreakpointIn(double fromS, double toS, EnvironmentCursor cursor)
    {
        if (Irradiance.HasBreakpointIn(fromS, toS, ref cursor.NextIrradianceBreakpoint)) return "irradiance change";
        if (Temperature.Profile.HasBreakpointIn(fromS, toS, ref cursor.NextTemperatureBreakpoint)) return "temperature change";
        return null;
    }
}
