namespace MpptArena.Plant;

/// <summary>Which front end sits between the array and the load.</summary>
public enum FrontEndKind
{
    /// <summary>Ideal voltage-controlled source with a first-order lag (algorithm-only comparisons).</summary>
    IdealSource,

    /// <summary>Boost converter average model (front end of a string inverter), output to a fixed DC bus.</summary>
    Boost,

    /// <summary>Buck converter average model (battery charge controller), output to a battery.</summary>
    Buck,
}

/// <summary>Parameters of the converter front end and of its inner voltage loop.</summary>
/// <param name="Kind">Topology.</param>
/// <param name="LagTimeConstantS">Ideal source: time constant of the first-order lag [s].</param>
/// <param name="InputCapacitanceF">PV-side input capacitance [F].</param>
/// <param name="InductanceH">Inductance [H].</param>
/// <param name="InductorResistanceOhm">Inductor series resistance [ohm].</param>
/// <param name="BusVoltageV">Boost: fixed DC bus voltage [V].</param>
/// <param name="BatteryVoltageV">Buck: battery open-circuit voltage [V].</param>
/// <param name="BatteryResistanceOhm">Buck: battery internal resistance [ohm].</param>
/// <param name="MinDuty">Lowest duty cycle the modulator produces [-].</param>
/// <param name="MaxDuty">Highest duty cycle the modulator produces [-].</param>
/// <param name="VoltageLoopBandwidthHz">Inner voltage loop crossover [Hz].</param>
/// <param name="CurrentLoopBandwidthHz">Innermost inductor-current loop crossover [Hz].</param>
/// <param name="MaxVoltageReferenceV">Highest voltage reference accepted [V].</param>
/// <param name="VoltageLoopIntegralHz">Zero of the voltage loop's PI controller [Hz]; 0 for proportional with feed-forward only.</param>
/// <param name="VoltageLoopRateHz">Rate at which the inner loops update the duty cycle [Hz]; 0 for continuous loops.</param>
/// <param name="SwitchingFrequencyHz">PWM switching frequency [Hz]; 0 takes the topology's typical value (<see cref="TypicalSwitchingFrequencyHz"/>).</param>
public sealed record ConverterSettings(
    FrontEndKind Kind,
    double LagTimeConstantS = 2e-3,
    double InputCapacitanceF = 220e-6,
    double InductanceH = 2e-3,
    double InductorResistanceOhm = 0.1,
    double BusVoltageV = 700,
    double BatteryVoltageV = 48,
    double BatteryResistanceOhm = 0.05,
    double MinDuty = 0.0,
    double MaxDuty = 0.95,
    double VoltageLoopBandwidthHz = 100,
    double CurrentLoopBandwidthHz = 1000,
    double MaxVoltageReferenceV = 1000,
    double VoltageLoopIntegralHz = 0,
    double VoltageLoopRateHz = 0,
    double SwitchingFrequencyHz = 0)
{
    /// <summary>PWM switching frequency [Hz].</summary>
    public double SwitchingFrequencyHz { get; init; } = SwitchingFrequencyHz > 0 ? SwitchingFrequencyHz : TypicalSwitchingFrequencyHz(Kind);

    /// <summary>
    /// Typical switching frequency of a topology [Hz] (common practice): 20 kHz for the boost stage of a
    /// string inverter (IGBTs, just above hearing), 50 kHz for the buck of a MOSFET charge controller.
    /// </summary>
    public static double TypicalSwitchingFrequencyHz(FrontEndKind kind) => kind == FrontEndKind.Buck ? 50e3 : 20e3;
}
