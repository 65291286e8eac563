namespace MpptArena.Scenarios;

/// <summary>Names that become part of file and folder names (scenarios, sweeps, trackers, scoring windows): one rule, one message shape.</summary>
internal static class FileSafeName
{
    /// <summary>Longest name [characters].</summary>
    public const int MaxLength = 64;

    /// <summary>True for 1 to <see cref="MaxLength"/> ASCII letters, digits, '-' and '_' (and '.' where <paramref name="dots"/>, not first unless <paramref name="leadingDot"/>).</summary>
    public static bool IsValid(string name, bool dots, bool leadingDot = false) =>
        name.Length is > 0 and <= MaxLength
        && (leadingDot || name[0] != '.')
        && name.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' || (dots && c == '.'));

    /// <summary>The name as a message shows it: cut after 80 characters.</summary>
    public static string Shown(string name) => name.Length > 80 ? name[..80] + "..." : name;
}
