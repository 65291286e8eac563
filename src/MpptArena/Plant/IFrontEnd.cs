using MpptArena.Arrays;
using MpptArena.Trackers;

namespace MpptArena.Plant;

/// <summary>A converter front end: explicit state advanced in time by the array current it draws.</summary>
public interface IFrontEnd
{
    /// <summary>True if the front end accepts commands of this kind.</summary>
    bool Accepts(TrackerCommandKind kind);

    /// <summary>Lowest and highest accepted command of a kind.</summary>
    (double Min, double Max) CommandRange(TrackerCommandKind kind);

    /// <summary>Sets the state as at power-up: the input capacitor charged to <paramref name="voltageV"/>, no current.</summary>
    void Reset(double voltageV);

    /// <summary>Advances the state by <paramref name="dtS"/> [s] with the command held.</summary>
    void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind);

    /// <summary>PV terminal voltage [V].</summary>
    double PvVoltageV { get; }

    /// <summary>PV current at the end of the last step [A].</summary>
    double PvCurrentA { get; }

    /// <summary>Duty cycle in force [-] (NaN for the ideal source).</summary>
    double DutyCycle { get; }

    /// <summary>Average inductor current [A] (NaN for the ideal source).</summary>
    double InductorCurrentA { get; }

    /// <summary>Time since reset in discontinuous conduction [s] (NaN for the ideal source).</summary>
    double DiscontinuousTimeS { get; }

    /// <summary>
    /// The instantaneous PV voltage [V], PV current [A] and inductor current [A] at <paramref name="phase"/>
    /// of the present switching period (0 = the switch turns on), switching ripple included. The ideal
    /// source has no ripple: its values at every phase, and NaN for the inductor.
    /// </summary>
    (double VoltageV, double PvCurrentA, double InductorCurrentA) InstantAt(double phase);

    /// <summary>Energies since reset.</summary>
    EnergyLedger Energy { get; }

    /// <summary>Energy stored in capacitor and inductor now [J].</summary>
    double StoredJ { get; }

    /// <summary>Fastest eigenvalue magnitude of the linearised dynamics for a curve slope [1/s], for step-size checks.</summary>
    double FastestRateEstimatePerS(double maxConductanceS);

    /// <summary>
    /// Tells the front end the largest incremental conductance of the array [S] it will see, so that a
    /// step it integrates explicitly is split into sub-steps with h |lambda_max| within
    /// <paramref name="stabilityLimit"/>.
    /// </summary>
    void SetStabilityBound(double maxConductanceS, double stabilityLimit);
}
