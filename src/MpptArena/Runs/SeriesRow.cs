namespace MpptArena.Runs;

/// <summary>One row of a tracker's time series.</summary>
/// <param name="TimeS">End of the interval [s].</param>
/// <param name="VoltageV">Mean PV voltage over the interval [V].</param>
/// <param name="CurrentA">Mean PV current [A].</param>
/// <param name="PowerW">Mean PV power [W].</param>
/// <param name="MppPowerW">Mean global MPP power [W].</param>
/// <param name="MppVoltageV">Global MPP voltage at the end of the interval [V].</param>
/// <param name="Command">Command in force at the end of the interval [V or -].</param>
/// <param name="InductorCurrentA">Mean average-model inductor current over the interval [A]; NaN for the ideal source.</param>
/// <param name="DutyCycle">Mean duty cycle over the interval [-]; NaN for the ideal source.</param>
/// <param name="DiscontinuousShare">Share of the interval in discontinuous conduction [-]; NaN for the ideal source.</param>
public readonly record struct SeriesRow(double TimeS, double VoltageV, double CurrentA, double PowerW, double MppPowerW, double MppVoltageV, double Command,
    double InductorCurrentA = double.NaN, double DutyCycle = double.NaN, double DiscontinuousShare = double.NaN);
