namespace MpptArena.Arrays;

/// <summary>The current-voltage characteristic of a whole array at one instant.</summary>
public interface IArrayCurve
{
    /// <summary>Array current [A] at array terminal voltage [V].</summary>
    double CurrentAtVoltage(double voltageV);

    /// <summary>Array open-circuit voltage [V]: where the current reaches zero.</summary>
    double OpenCircuitVoltageV { get; }
}
