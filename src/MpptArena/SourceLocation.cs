namespace MpptArena;

/// <summary>A position in an input file, 1-based, as editors show it.</summary>
/// <param name="File">Path of the file as given by the user.</param>
/// <param name="Line">Line [1-based].</param>
/// <param name="Column">Column [1-based].</param>
public sealed record SourceLocation(string File, long Line, long Column)
{
    /// <inheritdoc/>
    public override string ToString() => $"{File}:{Line}:{Column}";
}
