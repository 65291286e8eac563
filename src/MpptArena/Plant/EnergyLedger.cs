namespace MpptArena.Plant;

/// <summary>Energies integrated with the plant state, for the energy balance check.</summary>
public struct EnergyLedger
{
    /// <summary>Energy taken from the array [J].</summary>
    public double FromArrayJ;

    /// <summary>Energy delivered at the converter output [J].</summary>
    public double DeliveredJ;

    /// <summary>Energy dissipated in the converter's resistances [J].</summary>
    public double LossJ;
}
