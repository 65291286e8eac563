using MpptArena.Numerics;

namespace MpptArena.Pv;

/// <summary>
/// Translation of single-diode parameters from reference conditions to any irradiance and cell
/// temperature.
/// </summary>
/// <remarks>
/// W. De Soto, S. A. Klein, W. A. Beckman, "Improvement and validation of a model for photovoltaic
/// array performance", Solar Energy 80 (2006) 78-88, eqs. 3-9 with the air-mass modifier taken as 1
/// (AM1.5): a/a_ref = Tc/T_ref; IL = (S/S_ref)[IL_ref + alpha_Isc (Tc - T_ref)];
/// I0/I0_ref = (Tc/T_ref)^3 exp[(Eg_ref/T_ref - Eg/Tc)/k]; Eg = Eg_ref [1 - 0.0002677 (Tc - T_ref)];
/// Rsh/Rsh_ref = S_ref/S; Rs constant.
/// </remarks>
public static class DeSotoTranslation
{
    /// <summary>Band gap of crystalline silicon at 25 degC [eV] (De Soto et al. 2006, sec. 2).</summary>
    public const double SiliconBandGapEv = 1.121;

    /// <summary>Temperature coefficient of the band gap, dEg/dT / Eg_ref [1/K] (De Soto et al. 2006, eq. 6).</summary>
    public const double BandGapTemperatureCoefficientPerK = -0.0002677;

    /// <summary>Parameters at an operating condition.</summary>
    /// <param name="module">Module model at reference conditions.</param>
    /// <param name="irradianceWm2">Effective irradiance [W/m2], zero or positive.</param>
    /// <param name="cellTemperatureC">Cell temperature [degC].</param>
    public static SingleDiodeParameters Translate(ModuleModel module, double irradianceWm2, double cellTemperatureC)
    {
        var r = module.Reference;
        double s = Math.Max(irradianceWm2, 0.0) / module.ReferenceIrradianceWm2;
        double tRefK = PhysicalConstants.KelvinFromCelsius(module.ReferenceCellTemperatureC);
        double tK = PhysicalConstants.KelvinFromCelsius(cellTemperatureC);
        double dT = cellTemperatureC - module.ReferenceCellTemperatureC;

        double a = r.ModifiedIdealityV * tK / tRefK;
        double il = Math.Max(s * (r.PhotocurrentA + module.IscTemperatureCoefficientAPerK * dT), 0.0);
        double egRef = module.BandGapEv;
        double eg = egRef * (1.0 + BandGapTemperatureCoefficientPerK * dT);
        double i0 = r.SaturationCurrentA * Cube(tK / tRefK)
                    * PortableMath.Exp((egRef / tRefK - eg / tK) / PhysicalConstants.BoltzmannEvPerK);
        double gsh = r.ShuntConductanceS * s;
        return new SingleDiodeParameters(il, i0, a, r.SeriesResistanceOhm, gsh);
    }

    private static double Cube(double x) => x * x * x;
}
