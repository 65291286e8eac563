using System.Text.Json;
using System.Text.RegularExpressions;

namespace MpptArena.Reports.Summary;

/// <summary>A System.Text.Json error in words a user reads: what was expected and where, without .NET type names.</summary>
public static partial class JsonErrorText
{
    /// <summary>The message of <paramref name="ex"/> with type names replaced by what they mean, and the JSON path.</summary>
    public static string Describe(JsonException ex)
    {
        string text = ex.Message.Split(" Path:")[0].Split(" LineNumber:")[0];
        text = TypeName().Replace(text, m => Word(m.Value));
        return ex.Path is { Length: > 1 } path ? $"{text.TrimEnd('.')} (at {path})" : text;
    }

    private static string Word(string type) => type switch
    {
        _ when type.StartsWith("System.Nullable`1[System.Double]", StringComparison.Ordinal) => "a number or null",
        _ when type.StartsWith("System.Nullable`1", StringComparison.Ordinal) => "a value or null",
        "System.Double" or "System.Single" or "System.Decimal" => "a number",
        "System.Int32" or "System.Int64" or "System.UInt64" or "System.UInt32" => "a whole number",
        "System.Boolean" => "true or false",
        "System.String" => "text",
        _ when type.Contains("Dictionary", StringComparison.Ordinal) => "an object",
        _ when type.Contains("List", StringComparison.Ordinal) || type.EndsWith("[]", StringComparison.Ordinal) => "a list",
        _ => "an object",
    };

    [GeneratedRegex(@"System\.[A-Za-z0-9_.`]+(\[[^\]\s]*\])*(\[\])?|MpptArena\.[A-Za-z0-9_.]+")]
    private static partial Regex TypeName();
}
