using MpptArena.Pv;

namespace MpptArena.Tests.Pv;

public class DatasheetFitTests
{
    public static TheoryData<string> Sheets => new() { "villalva54", "invented60" };

    private static ModuleDatasheet Sheet(string name) =>
        name == "villalva54" ? ReferenceModules.Villalva54Cell : ReferenceModules.Invented60Cell;

    [Theory]
    [MemberData(nameof(Sheets))]
    public void FitReproducesTheDatasheetPointsWithin0Point1Percent(string name)
    {
        // Requirement of the De Soto et al. (2006) method: the model passes through (0, Isc), (Voc, 0), (Vmp, Imp).
        var sheet = Sheet(name);
        var p = DeSotoDatasheetFit.Fit(sheet).Reference;
        Assert.Equal(sheet.ShortCircuitCurrentA, SingleDiodeModel.ShortCircuitCurrentA(p), sheet.ShortCircuitCurrentA * 1e-3);
        Assert.Equal(sheet.OpenCircuitVoltageV, SingleDiodeModel.OpenCircuitVoltageV(p), sheet.OpenCircuitVoltageV * 1e-3);
        Assert.Equal(sheet.MppCurrentA, SingleDiodeModel.CurrentAtVoltage(p, sheet.MppVoltageV), sheet.MppCurrentA * 1e-3);
        var mpp = SingleDiodeModel.MaximumPowerPoint(p);
        Assert.Equal(sheet.MppVoltageV, mpp.VoltageV, sheet.MppVoltageV * 1e-3);
        Assert.Equal(sheet.MppCurrentA, mpp.CurrentA, sheet.MppCurrentA * 1e-3);
        Assert.True(p.SeriesResistanceOhm > 0 && p.ShuntConductanceS >= 0 && p.SaturationCurrentA > 0);
    }

    [Theory]
    [MemberData(nameof(Sheets))]
    public void VocFallsWithTemperatureAtTheDatasheetCoefficient(string name)
    {
        // The fifth De Soto (2006) equation; checked here over a wider span (0 to 50 degC) than fitted.
        var sheet = Sheet(name);
        var model = DeSotoDatasheetFit.Fit(sheet);
        double cold = SingleDiodeModel.OpenCircuitVoltageV(model.At(1000, 0));
        double hot = SingleDiodeModel.OpenCircuitVoltageV(model.At(1000, 50));
        double beta = (hot - cold) / 50.0;
        Assert.Equal(sheet.VocTemperatureCoefficientVPerK, beta, Math.Abs(sheet.VocTemperatureCoefficientVPerK) * 0.02);
    }

    [Fact]
    public void PhotocurrentIsProportionalToIrradiance()
    {
        // De Soto et al. (2006) eq. 3: IL = (S/S_ref) IL_ref at reference temperature.
        var model = ReferenceModules.Fitted60;
        double ilRef = model.Reference.PhotocurrentA;
        foreach (double g in new[] { 0.0, 100.0, 500.0, 1000.0, 1500.0 })
        {
            Assert.Equal(ilRef * g / 1000.0, model.At(g, 25).PhotocurrentA, 1e-12);
        }
        // Isc follows closely (Rs/Rsh ratio makes Isc slightly below IL).
        Assert.Equal(0.5, SingleDiodeModel.ShortCircuitCurrentA(model.At(500, 25)) / SingleDiodeModel.ShortCircuitCurrentA(model.At(1000, 25)), 1e-3);
    }

    [Fact]
    public void SaturationCurrentRisesWithTemperatureByTheBandGapLaw()
    {
        // De Soto et al. (2006) eqs. 5-6, checked against a direct evaluation of the formula.
        var model = ReferenceModules.Fitted60;
        double t1 = 298.15, t2 = 348.15;
        double eg2 = 1.121 * (1 - 0.0002677 * 50);
        double expected = model.Reference.SaturationCurrentA * Math.Pow(t2 / t1, 3) * Math.Exp((1.121 / t1 - eg2 / t2) / 8.617333262e-5);
        Assert.Equal(expected, model.At(1000, 75).SaturationCurrentA, expected * 1e-8); // k/q quoted to 10 digits
    }

    [Theory]
    [InlineData(9.5, 38.2, 9.0, 38.5, "mpp_voltage_v")]
    [InlineData(9.5, 38.2, 9.6, 31.4, "mpp_current_a")]
    [InlineData(9.5, 38.2, 9.45, 37.0, "mpp_current_a")] // fill factor 0.963, above the ideal limit
    [InlineData(-1.0, 38.2, 9.0, 31.4, "short_circuit_current_a")]
    public void ImpossibleDatasheetsAreRefusedNamingTheField(double isc, double voc, double imp, double vmp, string field)
    {
        var sheet = new ModuleDatasheet(isc, voc, imp, vmp, 60, 0.0045, -0.118);
        var error = Assert.Throws<ArenaInputException>(() => DeSotoDatasheetFit.Fit(sheet));
        Assert.Equal(field, error.Field);
        Assert.Contains(field, error.Message);
    }

    [Fact]
    public void TheFittedIdealityFactorIsReportedAndOneOutsideOneToTwoIsWarnedAbout()
    {
        // The diode ideality factor of a crystalline-silicon cell lies between 1 (diffusion current) and 2
        // (recombination in the depletion region): C. T. Sah, R. N. Noyce, W. Shockley, "Carrier generation
        // and recombination in p-n junctions and p-n junction characteristics", Proc. IRE 45(9), 1957.
        var bundled = DeSotoDatasheetFit.Fit(new ModuleDatasheet(9.50, 38.2, 8.95, 31.0, 60, 0.0045, -0.135));
        Assert.InRange(bundled.IdealityFactor, 1.0, 2.0);
        Assert.Null(MpptArena.Scenarios.ScenarioLoader.IdealityWarning(bundled));
        var unphysical = ReferenceModules.Fitted60; // the tests' own invented sheet fits to about 0.95
        Assert.InRange(unphysical.IdealityFactor, 0.9, 0.99);
        Assert.Contains("below the physical lower limit of 1", MpptArena.Scenarios.ScenarioLoader.IdealityWarning(unphysical));
        var yaml = TestScenarios.Yaml();
        var s = TestScenarios.Parse(yaml);
        Assert.Contains(s.Warnings, w => w.StartsWith("test.yaml:", StringComparison.Ordinal) && w.Contains("ideality factor of 0.95", StringComparison.Ordinal));
    }
}
