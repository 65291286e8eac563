using System.Reflection;

namespace MpptArena;

/// <summary>The arena's version: the release number, and the build (release number and source commit) results are tied to.</summary>
public static class ArenaVersion
{
    private static readonly string Informational =
        typeof(ArenaVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "0.0.0";

    /// <summary>Release number, e.g. 0.1.0.</summary>
    public static string Release => Informational.Split('+')[0];

    /// <summary>Release number and the source commit it was built from when known, e.g. 0.1.0+0d6600bb…: part of every sweep case's identity.</summary>
    public static string Build => Informational;
}
