namespace MpptArena.Arrays;

/// <summary>How cells form the array: substrings with bypass diodes in modules, modules in strings, strings in parallel.</summary>
/// <param name="SubstringsPerModule">Substrings per module, each with its own bypass diode [-]; 3 is common practice for 60- and 72-cell modules.</param>
/// <param name="ModulesPerString">Modules in series in one string [-].</param>
/// <param name="StringsInParallel">Strings in parallel [-].</param>
/// <param name="Bypass">Bypass diode across each substring.</param>
/// <param name="Blocking">Blocking diode in series with each string, or null for none.</param>
public sealed record ArrayLayout(
    int SubstringsPerModule,
    int ModulesPerString,
    int StringsInParallel,
    BypassDiode Bypass,
    BypassDiode? Blocking = null)
{
    /// <summary>Substrings in one string.</summary>
    public int SubstringsPerString => SubstringsPerModule * ModulesPerString;

    /// <summary>Substrings in the array.</summary>
    public int SubstringCount => SubstringsPerString * StringsInParallel;

    /// <summary>Flat index of a substring: (string, module in string, substring in module), all 0-based.</summary>
    /// <param name="stringIndex">String [0-based].</param>
    /// <param name="moduleIndex">Module within the string [0-based].</param>
    /// <param name="substringIndex">Substring within the module [0-based].</param>
    public int IndexOf(int stringIndex, int moduleIndex, int substringIndex) =>
        (stringIndex * ModulesPerString + moduleIndex) * SubstringsPerModule + substringIndex;
}
