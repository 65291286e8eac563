using System.Text.Json;
using System.Text.Json.Serialization;

namespace MpptArena.Reports.Summary;

/// <summary>Reads and writes summary.json.</summary>
public static class SummaryJson
{
    /// <summary>Serializer settings: snake_case keys, indented, nulls kept (a null score means "undefined", not "missing").</summary>
    public static JsonSerializerOptions Options { get; } = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DictionaryKeyPolicy = null,
        WriteIndented = true,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        NumberHandling = JsonNumberHandling.Strict,
    };

    /// <summary>The JSON text of a summary.</summary>
    public static string Serialize(RunSummary summary) => JsonSerializer.Serialize(summary, Options) + "\n";

    /// <summary>A summary from JSON text; <paramref name="file"/> names the source in errors.</summary>
    /// <exception cref="ArenaInputException">Not a summary of a known schema.</exception>
    public static RunSummary Deserialize(string json, string file)
    {
        RunSummary? summary;
        try
        {
            summary = JsonSerializer.Deserialize<RunSummary>(json, Options);
        }
        catch (JsonException ex)
        {
            throw new ArenaInputException($"not a valid summary: {JsonErrorText.Describe(ex)}", null,
                new SourceLocation(file, (ex.LineNumber ?? 0) + 1, (ex.BytePositionInLine ?? 0) + 1));
        }
        if (summary is null) throw new ArenaInputException("not a valid summary: empty document", null, new SourceLocation(file, 1, 1));
        if (summary.Schema != RunSummary.SchemaId && summary.Schema != RunSummary.PreviousSchemaId)
        {
            throw new ArenaInputException($"summary schema '{summary.Schema}' is not supported; expected '{RunSummary.SchemaId}' or '{RunSummary.PreviousSchemaId}'", "schema", new SourceLocation(file, 1, 1));
        }
        if (summary.Trackers is null || summary.Scenario is null) throw new ArenaInputException("not a valid summary: it has no 'scenario' or no 'trackers'", null, new SourceLocation(file, 1, 1));
        var twice = summary.Trackers.GroupBy(t => t.Name).FirstOrDefault(g => g.Count() > 1);
        if (twice is not null) throw new ArenaInputException($"not a valid summary: tracker name '{twice.Key}' appears {twice.Count()} times", "trackers", new SourceLocation(file, 1, 1));
        if (summary.Trackers.FirstOrDefault(t => t.Scores is null && !t.Failed) is { } noScores)
        {
            throw new ArenaInputException($"not a valid summary: tracker '{noScores.Name}' has no scores and did not fail", "trackers", new SourceLocation(file, 1, 1));
        }
        return summary;
    }

    /// <summary>Reads a summary file, or summary.json inside a results folder.</summary>
    public static RunSummary Read(string path)
    {
        string file = Directory.Exists(path) ? Path.Combine(path, "summary.json") : path;
        if (!File.Exists(file)) throw new ArenaInputException($"summary '{file}' not found (give a summary.json or a results folder that holds one)", "file");
        return Deserialize(Scenarios.YamlInput.ReadText(file, "summary"), file);
    }
}
