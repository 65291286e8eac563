namespace MpptArena.Trackers;

/// <summary>What a tracker sees at one sample: sensed values, never the plant's true state.</summary>
/// <param name="TimeS">Sample instant [s] on the simulation clock.</param>
/// <param name="VoltageV">Sensed PV voltage [V] (averaged codes times the LSB).</param>
/// <param name="CurrentA">Sensed PV current [A] (averaged codes times the LSB).</param>
/// <param name="VoltageCode">Averaged raw voltage ADC code [counts], as fixed-point firmware sees it.</param>
/// <param name="CurrentCode">Averaged raw current ADC code [counts].</param>
/// <param name="PreviousCommand">The command in force until now [V or -].</param>
/// <param name="Conversions">ADC conversions averaged into this sample [-]; code sums are the averages times this.</param>
public readonly record struct TrackerMeasurement(
    double TimeS, double VoltageV, double CurrentA, double VoltageCode, double CurrentCode, double PreviousCommand, int Conversions = 1)
{
    /// <summary>Sensed power [W].</summary>
    public double PowerW => VoltageV * CurrentA;
}
