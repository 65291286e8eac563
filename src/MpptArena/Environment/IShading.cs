namespace MpptArena.Environment;

/// <summary>Something that takes away part of the light of some substrings over time.</summary>
public interface IShading
{
    /// <summary>Multiplies each substring's irradiance factor by the share of light this shade lets through at <paramref name="timeS"/> [s].</summary>
    /// <param name="timeS">Simulation time [s].</param>
    /// <param name="factors">Per-substring factor [-], indexed as the array layout; 1 = unshaded.</param>
    void Apply(double timeS, double[] factors);
}
