namespace MpptArena;

/// <summary>
/// Input that cannot describe a physical plant or a valid run: a datasheet that cannot be fitted,
/// a scenario key with a wrong value. Front ends print <see cref="Exception.Message"/> and exit
/// non-zero; it never carries a stack trace to the user.
/// </summary>
public sealed class ArenaInputException : Exception
{
    /// <summary>New input error.</summary>
    /// <param name="message">What is wrong and what was expected.</param>
    /// <param name="field">The field or key the error is about, if one.</param>
    /// <param name="location">Where in a file, if known.</param>
    public ArenaInputException(string message, string? field = null, SourceLocation? location = null)
        : base(location is null ? message : $"{location}: {message}")
    {
        Field = field;
        Location = location;
        Reason = message;
    }

    /// <summary>The field or key named by the error, if any.</summary>
    public string? Field { get; }

    /// <summary>File, line and column of the offending input, when it came from a file.</summary>
    public SourceLocation? Location { get; }

    /// <summary>The message without the location prefix.</summary>
    public string Reason { get; }
}
