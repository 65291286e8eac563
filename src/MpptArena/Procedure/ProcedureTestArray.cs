using MpptArena.Arrays;
using MpptArena.Pv;

namespace MpptArena.Procedure;

/// <summary>
/// The procedure's test array: one string of identical modules whose characteristic at STC has the technology's
/// shape (<see cref="CurveShape"/>) and its MPP at a given power and voltage, as a programmable PV simulator is set
/// for each test point (common practice).
/// </summary>
/// <remarks>The module is fitted by the method of De Soto, Klein and Beckman (Solar Energy 80, 2006) to a datasheet
/// built from the shape: Vmp = V / M, Imp = P / V, Voc = Vmp / (Vmpp/Voc), Isc = Imp / (Impp/Isc), for M modules
/// of 60 cells chosen so that a cell's open-circuit voltage is near the technology's.</remarks>
public static class ProcedureTestArray
{
    /// <summary>Cells per module of the test array [-].</summary>
    public const int CellsPerModule = 60;

    /// <summary>The test array with its STC maximum at <paramref name="powerW"/> and <paramref name="mppVoltageV"/>.</summary>
    /// <param name="shape">Curve shape.</param>
    /// <param name="powerW">MPP power at STC [W].</param>
    /// <param name="mppVoltageV">MPP voltage at STC [V].</param>
    /// <exception cref="ArenaInputException">No single-diode module has that shape (the fit fails).</exception>
    public static PvArray Build(CurveShape shape, double powerW, double mppVoltageV)
    {
        double vmp = mppVoltageV, imp = powerW / mppVoltageV;
        double voc = vmp / shape.MppToOpenCircuitVoltage, isc = imp / shape.MppToShortCircuitCurrent;
        int modules = Math.Max(1, (int)Math.Round(voc / (CellsPerModule * shape.CellOpenCircuitVoltageV)));
        double moduleVoc = voc / modules;
        var sheet = new ModuleDatasheet(isc, moduleVoc, imp, vmp / modules, CellsPerModule,
            shape.IscTemperatureCoefficientPerK * isc, shape.VocTemperatureCoefficientPerK * moduleVoc);
        ModuleModel module;
        try
        {
            module = DeSotoDatasheetFit.Fit(sheet);
        }
        catch (ArenaInputException ex)
        {
            throw new ArenaInputException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"the {shape.Name} test array for {powerW:0.#} W at {mppVoltageV:0.#} V cannot be built: {ex.Reason}"), "procedure");
        }
        var layout = new ArrayLayout(1, modules, 1, BypassDiode.FromForwardVoltage(0.45, Math.Max(1.0, isc)));
        return new PvArray(module, layout);
    }
}
