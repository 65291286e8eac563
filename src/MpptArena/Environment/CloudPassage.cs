namespace MpptArena.Environment;

/// <summary>
/// A cloud passing over the array: irradiance rises above the clear-sky level as the cloud edge
/// approaches (edge enhancement by light scattered from the cloud's side), falls to the shadowed level
/// at the ramp rate, stays there, and recovers through a second enhancement on the trailing edge.
/// </summary>
/// <remarks>
/// Cloud-edge enhancement of tens of percent over clear sky, and ramps of tens of W/m2 per second
/// under passing clouds, are common practice in the field literature (see project references).
/// The shape here is piecewise linear so that each part can be scored on its own.
/// </remarks>
/// <param name="ClearWm2">Clear-sky irradiance [W/m2].</param>
/// <param name="ShadowedWm2">Irradiance under the cloud [W/m2].</param>
/// <param name="EnhancementFraction">Peak excess over clear sky at each edge [-], e.g. 0.2.</param>
/// <param name="EnhancementS">Duration of each enhancement bump [s].</param>
/// <param name="RampWm2PerS">Slope of the fall and rise [W/m2/s].</param>
/// <param name="ShadowS">Time fully under the cloud [s].</param>
public sealed record CloudPassage(
    double ClearWm2, double ShadowedWm2, double EnhancementFraction, double EnhancementS, double RampWm2PerS, double ShadowS)
{
    /// <summary>Appends the passage to a profile that is at clear sky.</summary>
    /// <param name="builder">Profile being built.</param>
    public void AppendTo(ProfileBuilder builder)
    {
        double peak = ClearWm2 * (1.0 + EnhancementFraction);
        builder.Step(ClearWm2);
        builder.Ramp(peak, EnhancementS / 2).Ramp(ClearWm2, EnhancementS / 2);
        builder.RampAtRate(ShadowedWm2, RampWm2PerS).Hold(ShadowS).RampAtRate(ClearWm2, RampWm2PerS);
        builder.Ramp(peak, EnhancementS / 2).Ramp(ClearWm2, EnhancementS / 2);
    }
}
