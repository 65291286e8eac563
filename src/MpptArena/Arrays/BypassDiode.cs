using MpptArena.Numerics;
using MpptArena.Pv;

namespace MpptArena.Arrays;

/// <summary>
/// A diode by the Shockley equation, I = Is [exp(V/(n Vt)) - 1], used antiparallel to a substring
/// (bypass) or in series with a string (blocking). It has a forward voltage, not an ideal switch, so
/// the array curve stays continuous. Its saturation current is held constant with temperature.
/// </summary>
/// <remarks>Shockley diode equation; W. Shockley, Bell Syst. Tech. J. 28 (1949) 435-489.
/// Schottky bypass diodes drop about 0.4-0.5 V at module current (common practice).</remarks>
/// <param name="SaturationCurrentA">Is [A].</param>
/// <param name="IdealityFactor">n [-].</param>
public sealed record BypassDiode(double SaturationCurrentA, double IdealityFactor)
{
    /// <summary>A diode that drops <paramref name="forwardVoltageV"/> at <paramref name="atCurrentA"/> and 25 degC.</summary>
    /// <param name="forwardVoltageV">Forward voltage [V].</param>
    /// <param name="atCurrentA">Current at which it is specified [A].</param>
    /// <param name="idealityFactor">n [-], about 1 to 1.1 for Schottky diodes.</param>
    public static BypassDiode FromForwardVoltage(double forwardVoltageV, double atCurrentA, double idealityFactor = 1.0)
    {
        double nvt = idealityFactor * PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(25.0));
        return new BypassDiode(atCurrentA / PortableMath.ExpM1(forwardVoltageV / nvt), idealityFactor);
    }

    /// <summary>n Vt [V] at a junction temperature.</summary>
    /// <param name="temperatureC">Junction temperature [degC].</param>
    public double IdealityVoltageV(double temperatureC) =>
        IdealityFactor * PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(temperatureC));
}
