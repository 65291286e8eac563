namespace MpptArena.Procedure;

/// <summary>How the procedure is run on a user's converter.</summary>
/// <param name="RatedPowerW">Rated DC power [W]; the static levels are fractions of it.</param>
/// <param name="MinMppVoltageV">Lowest MPP voltage of the converter's window [V].</param>
/// <param name="RatedMppVoltageV">Rated MPP voltage [V]; the dynamic tests run there.</param>
/// <param name="MaxMppVoltageV">Highest MPP voltage of the window [V].</param>
/// <param name="Shape">Test-array curve shape; null to use the scenario's own array.</param>
/// <param name="StabilisationS">Time before each static measurement [s].</param>
/// <param name="MeasurementS">Static measurement time [s].</param>
/// <param name="Dynamic">Run the two ramp sequences.</param>
/// <param name="StartUpShutDown">Run the start-up and shut-down ramp.</param>
/// <param name="MaxSlopes">Ramp blocks per sequence (the first ones; all of them by default), for shorter pre-checks.</param>
public sealed record ProcedureSettings(
    double RatedPowerW,
    double MinMppVoltageV,
    double RatedMppVoltageV,
    double MaxMppVoltageV,
    CurveShape? Shape,
    double StabilisationS = ProcedureTable.DefaultStabilisationS,
    double MeasurementS = ProcedureTable.DefaultMeasurementS,
    bool Dynamic = true,
    bool StartUpShutDown = true,
    int? MaxSlopes = null);
