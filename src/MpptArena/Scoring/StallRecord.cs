namespace MpptArena.Scoring;

/// <summary>
/// A frozen command: the tracker kept its command unchanged while the global MPP voltage moved away by more than
/// the stall fraction from where it was when the command last changed (a dead band that stopped moving, a tracker
/// that gave up). A healthy hill climber changes its command every sample and never stalls.
/// </summary>
/// <param name="Stalled">True when any such time occurred.</param>
/// <param name="StallTimeS">Total time stalled [s].</param>
/// <param name="FirstStallS">When the first stall began [s]; null if none.</param>
/// <param name="StallEnergyLostWh">Energy lost while stalled [Wh] (also booked in the energy split).</param>
public sealed record StallRecord(bool Stalled, double StallTimeS, double? FirstStallS, double StallEnergyLostWh);
