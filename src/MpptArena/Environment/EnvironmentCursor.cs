namespace MpptArena.Environment;

/// <summary>
/// Where a run that steps forward in time last read the irradiance and temperature profiles, so that each
/// read starts there instead of searching the whole profile. One per run: the scenario itself is shared
/// between threads and holds no reading state.
/// </summary>
public sealed class EnvironmentCursor
{
    /// <summary>Segment of the irradiance profile read last.</summary>
    internal int IrradianceSegment;

    /// <summary>Segment of the temperature profile read last.</summary>
    internal int TemperatureSegment;

    /// <summary>First irradiance breakpoint at or after the last event check's start.</summary>
    internal int NextIrradianceBreakpoint;

    /// <summary>First temperature breakpoint at or after the last event check's start.</summary>
    internal int NextTemperatureBreakpoint;
}
