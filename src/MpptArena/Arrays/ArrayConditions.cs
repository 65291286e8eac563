namespace MpptArena.Arrays;

/// <summary>
/// Irradiance and cell temperature of every substring at one instant, indexed as
/// <see cref="ArrayLayout.IndexOf"/>.
/// </summary>
public sealed class ArrayConditions
{
    /// <summary>Conditions for <paramref name="substringCount"/> substrings, all at one irradiance and temperature.</summary>
    /// <param name="substringCount">Substrings in the array [-].</param>
    /// <param name="irradianceWm2">Irradiance [W/m2].</param>
    /// <param name="cellTemperatureC">Cell temperature [degC].</param>
    public ArrayConditions(int substringCount, double irradianceWm2 = 1000.0, double cellTemperatureC = 25.0)
    {
        IrradianceWm2 = new double[substringCount];
        CellTemperatureC = new double[substringCount];
        Array.Fill(IrradianceWm2, irradianceWm2);
        Array.Fill(CellTemperatureC, cellTemperatureC);
    }

    /// <summary>Effective irradiance on each substring [W/m2].</summary>
    public double[] IrradianceWm2 { get; }

    /// <summary>Cell temperature of each substring [degC].</summary>
    public double[] CellTemperatureC { get; }

    /// <summary>Deep copy.</summary>
    public ArrayConditions Clone()
    {
        var c = new ArrayConditions(IrradianceWm2.Length);
        IrradianceWm2.CopyTo(c.IrradianceWm2, 0);
        CellTemperatureC.CopyTo(c.CellTemperatureC, 0);
        return c;
    }

    /// <summary>Copies the values of another set of conditions of the same size.</summary>
    /// <param name="other">Source.</param>
    public void CopyFrom(ArrayConditions other)
    {
        other.IrradianceWm2.CopyTo(IrradianceWm2, 0);
        other.CellTemperatureC.CopyTo(CellTemperatureC, 0);
    }
}
