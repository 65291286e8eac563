namespace MpptArena.Arrays;

/// <summary>What a bypass or blocking diode is made of: it sets how its saturation current grows with temperature.</summary>
public enum DiodeMaterial
{
    /// <summary>Schottky barrier (the usual bypass diode): barrier 0.69 eV, saturation-current temperature exponent 2.</summary>
    Schottky,

    /// <summary>Silicon p-n junction: band gap 1.11 eV, saturation-current temperature exponent 3.</summary>
    Silicon,
}
