namespace MpptArena.Pv;

/// <summary>
/// The five parameters of the single-diode model of a group of series-connected cells at one
/// operating condition: I = IL - I0 [exp((V + I Rs)/a) - 1] - (V + I Rs)/Rsh.
/// </summary>
/// <remarks>
/// The shunt path is held as a conductance so that an unlit or ideal device (infinite Rsh) is the
/// plain value zero. Model as in W. De Soto, S. A. Klein, W. A. Beckman, "Improvement and
/// validation of a model for photovoltaic array performance", Solar Energy 80 (2006) 78-88, eq. 1.
/// </remarks>
/// <param name="PhotocurrentA">Light-generated current IL [A].</param>
/// <param name="SaturationCurrentA">Diode reverse saturation current I0 [A].</param>
/// <param name="ModifiedIdealityV">Modified ideality factor a = Ns n k Tc / q [V].</param>
/// <param name="SeriesResistanceOhm">Series resistance Rs [ohm], zero or positive.</param>
/// <param name="ShuntConductanceS">Shunt conductance 1/Rsh [S], zero or positive.</param>
public readonly record struct SingleDiodeParameters(
    double PhotocurrentA,
    double SaturationCurrentA,
    double ModifiedIdealityV,
    double SeriesResistanceOhm,
    double ShuntConductanceS)
{
    /// <summary>Shunt resistance Rsh [ohm]; infinity when the shunt conductance is zero.</summary>
    public double ShuntResistanceOhm => ShuntConductanceS > 0 ? 1.0 / ShuntConductanceS : double.PositiveInfinity;

    /// <summary>Parameters from a shunt resistance instead of a conductance.</summary>
    /// <param name="photocurrentA">IL [A].</param>
    /// <param name="saturationCurrentA">I0 [A].</param>
    /// <param name="modifiedIdealityV">a [V].</param>
    /// <param name="seriesResistanceOhm">Rs [ohm].</param>
    /// <param name="shuntResistanceOhm">Rsh [ohm]; infinity for no shunt path.</param>
    public static SingleDiodeParameters FromShuntResistance(
        double photocurrentA, double saturationCurrentA, double modifiedIdealityV,
        double seriesResistanceOhm, double shuntResistanceOhm) =>
        new(photocurrentA, saturationCurrentA, modifiedIdealityV, seriesResistanceOhm,
            double.IsPositiveInfinity(shuntResistanceOhm) ? 0.0 : 1.0 / shuntResistanceOhm);

    /// <summary>
    /// The same device split into a fraction of its cells: a, Rs and Rsh scale with the cell count,
    /// IL and I0 do not (cells in series carry one current).
    /// </summary>
    /// <param name="cellFraction">Cells of the part divided by cells of the whole [-].</param>
    public SingleDiodeParameters ScaledToCellFraction(double cellFraction) =>
        new(PhotocurrentA, SaturationCurrentA, ModifiedIdealityV * cellFraction,
            SeriesResistanceOhm * cellFraction, ShuntConductanceS / cellFraction);
}
