namespace MpptArena.Pv;

/// <summary>Exact SI constants and the thermal quantities derived from them.</summary>
/// <remarks>Source: BIPM, The International System of Units (SI Brochure), 9th edition, 2019:
/// the Boltzmann constant and the elementary charge are exact by definition since 2019.</remarks>
public static class PhysicalConstants
{
    /// <summary>Boltzmann constant [J/K], exact (SI Brochure 2019).</summary>
    public const double BoltzmannJPerK = 1.380649e-23;

    /// <summary>Elementary charge [C], exact (SI Brochure 2019).</summary>
    public const double ElementaryChargeC = 1.602176634e-19;

    /// <summary>Boltzmann constant in electron-volts per kelvin [eV/K] (k/q).</summary>
    public const double BoltzmannEvPerK = BoltzmannJPerK / ElementaryChargeC;

    /// <summary>0 degC in kelvin [K].</summary>
    public const double ZeroCelsiusK = 273.15;

    /// <summary>Thermal voltage kT/q of one junction [V].</summary>
    /// <param name="temperatureK">Junction temperature [K].</param>
    public static double ThermalVoltageV(double temperatureK) => BoltzmannEvPerK * temperatureK;

    /// <summary>Kelvin from degrees Celsius.</summary>
    /// <param name="temperatureC">Temperature [degC].</param>
    public static double KelvinFromCelsius(double temperatureC) => temperatureC + ZeroCelsiusK;
}
