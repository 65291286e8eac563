using MpptArena.Numerics;

namespace MpptArena.Pv;

/// <summary>
/// Fits the five single-diode parameters at STC to a module datasheet.
/// </summary>
/// <remarks>
/// Method of W. De Soto, S. A. Klein, W. A. Beckman, "Improvement and validation of a model for
/// photovoltaic array performance", Solar Energy 80 (2006) 78-88, sec. 3: five equations solved
/// together: the I-V equation at (0, Isc), (Voc, 0) and (Vmp, Imp); dP/dV = 0 at (Vmp, Imp); and the
/// model's Voc temperature coefficient equal to the datasheet's. For fixed (a, Rs) the first three
/// are linear in (IL, I0, 1/Rsh) and are solved exactly; the remaining two are solved by a damped
/// Newton iteration in (ln a, ln Rs), which keeps a and Rs positive.
/// </remarks>
public static class DeSotoDatasheetFit
{
    private const double TemperatureStepK = 5.0;

    /// <summary>Fit a module model to a datasheet.</summary>
    /// <param name="sheet">Datasheet values at STC.</param>
    /// <returns>The fitted model at STC.</returns>
    /// <exception cref="ArenaInputException">The datasheet is not physical, or no fit converged.</exception>
    public static ModuleModel Fit(ModuleDatasheet sheet)
    {
        Validate(sheet);
        double vt = PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(25.0)) * sheet.CellsInSeries;
        double rsScale = (sheet.OpenCircuitVoltageV - sheet.MppVoltageV) / sheet.MppCurrentA;
        foreach (double n in new[] { 1.2, 1.0, 1.5, 1.8 })
        {
            foreach (double rsFraction in new[] { 0.3, 0.1, 0.5, 0.02 })
            {
                var fitted = TryNewton(sheet, PortableMath.Log(n * vt), PortableMath.Log(rsFraction * rsScale));
                if (fitted is not null) return fitted;
            }
        }
        throw new ArenaInputException(
            "the datasheet could not be fitted by the De Soto (2006) method: no set of positive a, Rs, Rsh reproduces " +
            "Isc, Voc, Imp, Vmp and the Voc temperature coefficient together; check the values, in particular " +
            "voc_temperature_coefficient_v_per_k (volts per kelvin for the whole module, negative)", "datasheet");
    }

    /// <summary>Checks the datasheet describes a possible device before fitting.</summary>
    /// <param name="sheet">Datasheet values at STC.</param>
    public static void Validate(ModuleDatasheet sheet)
    {
        Require(sheet.ShortCircuitCurrentA > 0, "short_circuit_current_a", "must be positive");
        Require(sheet.OpenCircuitVoltageV > 0, "open_circuit_voltage_v", "must be positive");
        Require(sheet.MppCurrentA > 0, "mpp_current_a", "must be positive");
        Require(sheet.MppVoltageV > 0, "mpp_voltage_v", "must be positive");
        Require(sheet.CellsInSeries > 0, "cells_in_series", "must be a positive whole number");
        Require(sheet.MppVoltageV < sheet.OpenCircuitVoltageV, "mpp_voltage_v", "must be below open_circuit_voltage_v");
        Require(sheet.MppCurrentA < sheet.ShortCircuitCurrentA, "mpp_current_a", "must be below short_circuit_current_a");
        Require(sheet.VocTemperatureCoefficientVPerK < 0, "voc_temperature_coefficient_v_per_k", "must be negative (Voc falls as cells warm)");
        Require(double.IsFinite(sheet.IscTemperatureCoefficientAPerK), "isc_temperature_coefficient_a_per_k", "must be a number");

        // Upper bound: the fill factor of an ideal diode (n = 1, no resistances), M. A. Green,
        // Solid-State Electronics 24 (1981) 788, with the exact maximum instead of the empirical fit.
        double vt = PhysicalConstants.ThermalVoltageV(PhysicalConstants.KelvinFromCelsius(25.0)) * sheet.CellsInSeries;
        double ideal = IdealFillFactor(sheet.OpenCircuitVoltageV / vt);
        double ff = sheet.MppVoltageV * sheet.MppCurrentA / (sheet.OpenCircuitVoltageV * sheet.ShortCircuitCurrentA);
        Require(ff < ideal, "mpp_current_a",
            $"gives a fill factor of {ff:F4}, above the ideal-diode limit {ideal:F4} for this Voc and cell count; check mpp_current_a, mpp_voltage_v and cells_in_series");
    }

    /// <summary>Exact fill factor of an ideal diode at normalised open-circuit voltage voc = Voc/(n k T/q).</summary>
    /// <remarks>The maximum of v (1 - e^(v - voc)) is at v = W(e^(voc + 1)) - 1 (derived from dP/dv = 0).</remarks>
    /// <param name="normalisedVoc">voc [-].</param>
    public static double IdealFillFactor(double normalisedVoc)
    {
        double vmp = Numerics.LambertW.WrightOmega(normalisedVoc + 1.0) - 1.0;
        double imp = -PortableMath.ExpM1(vmp - normalisedVoc) / -PortableMath.ExpM1(-normalisedVoc);
        return vmp * imp / normalisedVoc;
    }

    private static void Require(bool ok, string field, string what)
    {
        if (!ok) throw new ArenaInputException($"datasheet field '{field}' {what}", field);
    }

    private static ModuleModel? TryNewton(ModuleDatasheet sheet, double lnA, double lnRs)
    {
        var r = Residuals(sheet, lnA, lnRs, out _);
        if (r is null) return null;
        for (int iteration = 0; iteration < 100; iteration++)
        {
            double norm = Norm(r.Value);
            if (norm < 1e-11)
            {
                Residuals(sheet, lnA, lnRs, out var p);
                if (p.ShuntConductanceS < 0 || p.SaturationCurrentA <= 0) return null;
                return Model(sheet, p);
            }
            const double h = 1e-7;
            var ra = Residuals(sheet, lnA + h, lnRs, out _);
            var rr = Residuals(sheet, lnA, lnRs + h, out _);
            if (ra is null || rr is null) return null;
            double j11 = (ra.Value.Slope - r.Value.Slope) / h, j12 = (rr.Value.Slope - r.Value.Slope) / h;
            double j21 = (ra.Value.Voc - r.Value.Voc) / h, j22 = (rr.Value.Voc - r.Value.Voc) / h;
            double det = j11 * j22 - j12 * j21;
            if (det == 0 || !double.IsFinite(det)) return null;
            double dA = -(j22 * r.Value.Slope - j12 * r.Value.Voc) / det;
            double dR = -(-j21 * r.Value.Slope + j11 * r.Value.Voc) / det;
            // Damping: never move ln a or ln Rs by more than 1 in one step, halve until the residual falls.
            double scale = Math.Min(1.0, 1.0 / Math.Max(Math.Abs(dA), Math.Abs(dR)));
            bool improved = false;
            for (int halving = 0; halving < 30; halving++)
            {
                var trial = Residuals(sheet, lnA + scale * dA, lnRs + scale * dR, out _);
                if (trial is not null && Norm(trial.Value) < norm)
                {
                    lnA += scale * dA; lnRs += scale * dR; r = trial; improved = true;
                    break;
                }
                scale *= 0.5;
            }
            if (!improved)
            {
                // Stalled at the noise floor of the finite-difference Jacobian: accept if close.
                if (norm > 1e-8) return null;
                Residuals(sheet, lnA, lnRs, out var p);
                return p.ShuntConductanceS < 0 ? null : Model(sheet, p);
            }
        }
        return null;
    }

    private static double Norm((double Slope, double Voc) r) => Math.Sqrt(r.Slope * r.Slope + r.Voc * r.Voc);

    private static ModuleModel Model(ModuleDatasheet sheet, SingleDiodeParameters p) =>
        new(p, sheet.CellsInSeries, sheet.IscTemperatureCoefficientAPerK);

    /// <summary>
    /// Solves the three point equations for (IL, I0, Gsh) at given (a, Rs) and returns the two
    /// remaining residuals, each made dimensionless.
    /// </summary>
    private static (double Slope, double Voc)? Residuals(ModuleDatasheet s, double lnA, double lnRs, out SingleDiodeParameters p)
    {
        p = default;
        double a = PortableMath.Exp(lnA), rs = PortableMath.Exp(lnRs);
        double isc = s.ShortCircuitCurrentA, voc = s.OpenCircuitVoltageV, imp = s.MppCurrentA, vmp = s.MppVoltageV;
        if (voc / a > 700) return null;
        double e1 = PortableMath.ExpM1(isc * rs / a), e2 = PortableMath.ExpM1(voc / a), e3 = PortableMath.ExpM1((vmp + imp * rs) / a);
        // Rows (Isc) - (Voc) and (MPP) - (Voc) eliminate IL:
        //   -I0 (e1 - e2) - Gsh (Isc Rs - Voc) = Isc;  -I0 (e3 - e2) - Gsh (Vmp + Imp Rs - Voc) = Imp.
        double a11 = -(e1 - e2), a12 = -(isc * rs - voc);
        double a21 = -(e3 - e2), a22 = -(vmp + imp * rs - voc);
        double det = a11 * a22 - a12 * a21;
        if (det == 0 || !double.IsFinite(det)) return null;
        double i0 = (isc * a22 - a12 * imp) / det;
        double gsh = (a11 * imp - a21 * isc) / det;
        if (!(i0 > 0)) return null;
        double il = i0 * e2 + gsh * voc;
        p = new SingleDiodeParameters(il, i0, a, rs, gsh);

        double g = i0 / a * (e3 + 1.0) + gsh;
        double slopeResidual = (imp - vmp * g / (1.0 + rs * g)) / imp;

        var model = Model(s, p);
        double vocHot = SingleDiodeModel.OpenCircuitVoltageV(model.At(1000.0, 25.0 + TemperatureStepK));
        double vocCold = SingleDiodeModel.OpenCircuitVoltageV(model.At(1000.0, 25.0 - TemperatureStepK));
        double betaModel = (vocHot - vocCold) / (2 * TemperatureStepK);
        double vocResidual = (betaModel - s.VocTemperatureCoefficientVPerK) / Math.Abs(s.VocTemperatureCoefficientVPerK);
        if (!double.IsFinite(slopeResidual) || !double.IsFinite(vocResidual)) return null;
        return (slopeResidual, vocResidual);
    }
}
