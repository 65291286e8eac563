using MpptArena.Arrays;
using MpptArena.Trackers;

namespace MpptArena.Plant;

/// <summary>
/// An ideal voltage-controlled source: the PV voltage follows the reference through a first-order
/// lag, v' = (v_ref - v)/tau, integrated exactly (v(t+h) = v_ref + (v - v_ref) e^(-h/tau)). The
/// source cannot push current into the array, so the operating voltage is limited to [0, Voc].
/// Energy over a step by Simpson's rule on the exact trajectory.
/// </summary>
public sealed class IdealSourceFrontEnd(ConverterSettings settings) : IFrontEnd
{
    private double _v, _vOperating, _i;
    private EnergyLedger _energy;

    /// <inheritdoc/>
    public bool Accepts(TrackerCommandKind kind) => kind == TrackerCommandKind.VoltageReference;

    /// <inheritdoc/>
    public (double Min, double Max) CommandRange(TrackerCommandKind kind) => (0.0, settings.MaxVoltageReferenceV);

    /// <inheritdoc/>
    public void Reset(double voltageV)
    {
        _v = voltageV;
        _vOperating = voltageV;
        _i = 0;
        _energy = default;
    }

    /// <inheritdoc/>
    public void Step(double dtS, PreparedArrayCurve curve, double command, TrackerCommandKind kind)
    {
        double decay = Math.Exp(-dtS / settings.LagTimeConstantS);
        double halfDecay = Math.Exp(-0.5 * dtS / settings.LagTimeConstantS);
        double voc = curve.OpenCircuitVoltageV;
        double p0 = Power(curve, _v, voc, out _);
        double vMid = command + (_v - command) * halfDecay;
        double pMid = Power(curve, vMid, voc, out _);
        _v = command + (_v - command) * decay;
        double p1 = Power(curve, _v, voc, out _i);
        _vOperating = Math.Clamp(_v, 0.0, voc);
        double e = dtS / 6.0 * (p0 + 4 * pMid + p1);
        _energy.FromArrayJ += e;
        _energy.DeliveredJ += e;
    }

    private static double Power(PreparedArrayCurve curve, double v, double voc, out double current)
    {
        double op = Math.Clamp(v, 0.0, voc);
        current = Math.Max(curve.CurrentAtVoltage(op), 0.0);
        return op * current;
    }

    /// <inheritdoc/>
    public double PvVoltageV => _vOperating;

    /// <inheritdoc/>
    public double PvCurrentA => _i;

    /// <inheritdoc/>
    public double DutyCycle => double.NaN;

    /// <inheritdoc/>
    public EnergyLedger Energy => _energy;

    /// <inheritdoc/>
    public double StoredJ => 0;

    /// <inheritdoc/>
    public double FastestRateEstimatePerS(double maxConductanceS) => 0; // exact integration: no stability limit

    /// <inheritdoc/>
    public void SetStabilityBound(double maxConductanceS, double stabilityLimit)
    {
        // Exact integration: nothing to split.
    }
}
