namespace MpptArena.Trackers.BuiltIn;

/// <summary>
/// The perturb-and-observe decision shared by the hill climbers: keep the direction while power rises,
/// turn back when it falls (Femia, Petrone, Spagnuolo, Vitelli, IEEE Trans. Power Electronics 20(4), 2005).
/// </summary>
internal struct HillClimbDirection
{
    private double _previousPowerW;

    /// <summary>+1 or -1.</summary>
    public int Direction { get; private set; }

    /// <summary>Starts over, moving in <paramref name="direction"/> with no power seen yet.</summary>
    public void Reset(int direction)
    {
        Direction = direction;
        _previousPowerW = 0;
    }

    /// <summary>Takes the power of this sample [W]; returns the direction for the next perturbation.</summary>
    public int Next(double powerW)
    {
        if (powerW < _previousPowerW) Direction = -Direction;
        _previousPowerW = powerW;
        return Direction;
    }
}
