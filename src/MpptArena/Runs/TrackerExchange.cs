namespace MpptArena.Runs;

/// <summary>One tracker call: what it was given and what it answered.</summary>
/// <param name="TimeS">Sample instant [s].</param>
/// <param name="VoltageV">Sensed PV voltage [V].</param>
/// <param name="CurrentA">Sensed PV current [A].</param>
/// <param name="Command">Command returned [V or -]; NaN where the call did not return one.</param>
public readonly record struct TrackerExchange(double TimeS, double VoltageV, double CurrentA, double Command);
