using MpptArena.Numerics;
using MpptArena.Pv;

namespace MpptArena.Arrays;

/// <summary>
/// A diode by the Shockley equation, I = Is [exp(V/(n Vt)) - 1], used antiparallel to a substring
/// (bypass) or in series with a string (blocking). It has a forward voltage, not an ideal switch, so
/// the array curve stays continuous. Its saturation current grows with temperature by the band-gap law
/// of the SPICE diode model, so its forward voltage falls as it warms (about 1 mV/K for a Schottky
/// diode, 1.6 mV/K for silicon at these currents).
/// </summary>
/// <remarks>Shockley diode equation; W. Shockley, Bell Syst. Tech. J. 28 (1949) 435-489. Temperature law
/// Is(T) = Is(T0) (T/T0)^(XTI/n) exp[(T/T0 - 1) Eg / (n Vt(T))]: L. W. Nagel, "SPICE2: a computer program to
/// simulate semiconductor circuits", ERL-M520, University of California, Berkeley, 1975 (the diode model's IS,
/// EG, XTI); Eg = 1.11 eV, XTI = 3 for a silicon junction and Eg = 0.69 eV, XTI = 2 for a Schottky barrier
/// are the values that model is used with [from memory]. A forward voltage falling by about 1-2 mV/K is
/// common practice. Schottky bypass diodes drop about 0.4-0.5 V at module current (common practice).</remarks>
/// <param name="SaturationCurrentA">Is at 25 degC [A].</param>
/// <param name="IdealityFactor">n [-].</param>
/// <param name="Material">Sets the band gap and temperature exponent of Is.</param>
public sealed record BypassDiode(double SaturationCurrentA, double IdealityFactor, DiodeMaterial Material = DiodeMaterial.Schottky)
{
    private const double ReferenceTemperatureC = 25.0;

    /// <summary>A diode that drops <paramref name="forwardVoltageV"/> at <paramref name="atCurrentA"/> and 25 degC.</summary>
    /// <param name="forwardVoltageV">Forward voltage [V].</param>
    /// <param name="atCurrentA">Current at which it is specified [A].</param>
    /// <param name="idealityFactor">n [-], about 1 to 1.1 for Schottky diodes.</param>
    /// <param name="material">What the diode is made of.</param>
    public static BypassDiode FromForwardVoltage(double forwardVoltageV, double atCurrentA, double idealityFactor = 1.0, DiodeMaterial material = DiodeMaterial.Schottky)
    {
        double nvt = idealityFactor * PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(ReferenceTemperatureC));
        return new BypassDiode(atCurrentA / PortableMath.ExpM1(forwardVoltageV / nvt), idealityFactor, material);
    }

    /// <summary>Band gap (barrier height for a Schottky diode) Eg [eV] of the temperature law.</summary>
    public double BandGapEv => Material == DiodeMaterial.Silicon ? 1.11 : 0.69;

    /// <summary>Temperature exponent XTI [-] of the saturation current.</summary>
    public double SaturationTemperatureExponent => Material == DiodeMaterial.Silicon ? 3.0 : 2.0;

    /// <summary>Saturation current Is [A] at a junction temperature, by the SPICE band-gap law.</summary>
    /// <param name="temperatureC">Junction temperature [degC].</param>
    public double SaturationCurrentAt(double temperatureC)
    {
        double t = PhysicalConstants.KelvinFromCelsius(temperatureC), t0 = PhysicalConstants.KelvinFromCelsius(ReferenceTemperatureC);
        double nvt = IdealityVoltageV(temperatureC);
        double ratio = t / t0;
        return SaturationCurrentA * PortableMath.Exp(SaturationTemperatureExponent / IdealityFactor * PortableMath.Log(ratio) + (ratio - 1.0) * BandGapEv / nvt);
    }

    /// <summary>n Vt [V] at a junction temperature.</summary>
    /// <param name="temperatureC">Junction temperature [degC].</param>
    public double IdealityVoltageV(double temperatureC) =>
        IdealityFactor * PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(temperatureC));
}
