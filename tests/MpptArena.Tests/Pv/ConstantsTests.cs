using MpptArena.Pv;

namespace MpptArena.Tests.Pv;

public class ConstantsTests
{
    [Fact]
    public void ThermalVoltageAt25CFollowsFromExactSiConstants()
    {
        // Source: BIPM SI Brochure, 9th ed., 2019 (k and q exact); kT/q at 298.15 K = 25.6926 mV (derived).
        Assert.Equal(0.0256926, PhysicalConstants.ThermalVoltageV(298.15), 1e-7);
        Assert.Equal(8.617333262e-5, PhysicalConstants.BoltzmannEvPerK, 1e-14);
    }

    [Fact]
    public void NoctRelationGivesTextbookCellTemperature()
    {
        // Source: G. M. Masters, Renewable and Efficient Electric Power Systems, Wiley 2004, eq. 5.23:
        // Tc = Ta + (NOCT - 20) G / 800. At NOCT conditions (20 degC, 800 W/m2) the cell sits at NOCT.
        Assert.Equal(45.0, NoctCellTemperature.CellTemperatureC(20.0, 800.0, 45.0), 12);
        Assert.Equal(30.0 + 25.0 * 1000.0 / 800.0, NoctCellTemperature.CellTemperatureC(30.0, 1000.0, 45.0), 12);
    }
}
