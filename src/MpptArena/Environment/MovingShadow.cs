namespace MpptArena.Environment;

/// <summary>
/// A shadow of a given width moving along one string at constant speed (a pole, a chimney or a
/// neighbouring row as the sun moves). Positions count substrings along the string from its first
/// substring; the shadow covers [front - width, front].
/// </summary>
/// <remarks>
/// A substring is taken as shaded as soon as the shadow touches it: its cells are in series, so the
/// most shaded cell limits the current of all of them (common practice; the reason bypass diodes
/// exist). Its irradiance drops to the shadow's transmittance.
/// </remarks>
/// <param name="FirstSubstringIndex">Flat index of the string's first substring.</param>
/// <param name="SubstringsInString">Substrings in the string [-].</param>
/// <param name="StartS">Time the front is at <paramref name="FromPosition"/> [s].</param>
/// <param name="EndS">Time the front reaches <paramref name="ToPosition"/> [s].</param>
/// <param name="FromPosition">Front position at the start [substrings].</param>
/// <param name="ToPosition">Front position at the end [substrings].</param>
/// <param name="WidthSubstrings">Shadow width [substrings].</param>
/// <param name="TransmittanceFraction">Share of light inside the shadow [-].</param>
public sealed record MovingShadow(
    int FirstSubstringIndex, int SubstringsInString, double StartS, double EndS,
    double FromPosition, double ToPosition, double WidthSubstrings, double TransmittanceFraction) : IShading
{
    /// <summary>Front position at a time [substrings]; held before the start and after the end.</summary>
    public double FrontAt(double timeS)
    {
        double u = Math.Clamp((timeS - StartS) / Math.Max(EndS - StartS, 1e-12), 0.0, 1.0);
        return FromPosition + (ToPosition - FromPosition) * u;
    }

    /// <inheritdoc/>
    public void Apply(double timeS, double[] factors)
    {
        double front = FrontAt(timeS);
        double back = front - WidthSubstrings;
        for (int k = 0; k < SubstringsInString; k++)
        {
            // Substring k spans [k, k + 1]; any overlap with (back, front) shades it.
            if (k + 1 > back && k < front) factors[FirstSubstringIndex + k] *= TransmittanceFraction;
        }
    }
}
