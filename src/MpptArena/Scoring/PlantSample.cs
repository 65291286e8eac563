namespace MpptArena.Scoring;

/// <summary>The plant over one integration step, as the scorer sees it (true values, not sensed).</summary>
/// <param name="TimeS">Time at the end of the step [s].</param>
/// <param name="DtS">Step length [s].</param>
/// <param name="VoltageV">PV voltage at the end of the step [V].</param>
/// <param name="PowerW">Mean PV power over the step [W] (energy taken divided by the step).</param>
/// <param name="MppPowerW">Power at the true global MPP for the conditions in force [W].</param>
/// <param name="MppVoltageV">Voltage of the true global MPP [V].</param>
/// <param name="MultiPeak">True when the P-V curve has more than one local maximum.</param>
/// <param name="OnGlobalHill">True when the operating voltage lies on the hill of the global maximum.</param>
/// <param name="StableForS">Time since the conditions last changed [s].</param>
/// <param name="Command">Command in force [V or -].</param>
public readonly record struct PlantSample(
    double TimeS, double DtS, double VoltageV, double PowerW,
    double MppPowerW, double MppVoltageV, bool MultiPeak, bool OnGlobalHill, double StableForS, double Command);
