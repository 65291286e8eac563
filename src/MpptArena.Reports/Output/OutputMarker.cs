using System.Text.Json;
using System.Text.Json.Serialization;
using MpptArena.Reports.Summary;

namespace MpptArena.Reports.Output;

/// <summary>
/// mppt-arena-output.json: the mark the arena leaves in every folder it writes. A folder is only ever
/// replaced when it carries this mark and holds nothing but the files and folders the mark lists.
/// </summary>
public sealed record OutputMarker
{
    /// <summary>Schema identifier.</summary>
    public const string SchemaId = "mppt-arena/output/1";

    /// <summary>File name of the mark inside an output folder.</summary>
    public const string FileName = "mppt-arena-output.json";

    /// <summary>Schema identifier.</summary>
    public required string Schema { get; init; }

    /// <summary>What wrote the folder: run, sweep, merge, curve or tune.</summary>
    public required string Kind { get; init; }

    /// <summary>Version of the tool that wrote it.</summary>
    public required string ToolVersion { get; init; }

    /// <summary>Files the arena wrote, relative to the folder, '/'-separated.</summary>
    public required IReadOnlyList<string> Files { get; init; }

    /// <summary>Folders whose whole contents the arena wrote (a sweep's growing case folder).</summary>
    public IReadOnlyList<string> Folders { get; init; } = [];

    private static readonly JsonSerializerOptions Options = new(SummaryJson.Options) { DefaultIgnoreCondition = JsonIgnoreCondition.Never };

    /// <summary>A mark for a folder of the given kind listing every file now in it.</summary>
    public static OutputMarker Describe(string folder, string kind, IReadOnlyList<string>? ownedFolders = null)
    {
        ownedFolders ??= [];
        var files = Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(folder, f).Replace('\\', '/'))
            .Where(f => f != FileName && !ownedFolders.Any(o => f.StartsWith(o + "/", StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal)
            .ToList();
        return new OutputMarker { Schema = SchemaId, Kind = kind, ToolVersion = SummaryBuilder.ToolVersion, Files = files, Folders = ownedFolders };
    }

    /// <summary>Writes the mark into <paramref name="folder"/> (atomically: a temporary file renamed into place).</summary>
    public void Write(string folder)
    {
        string temp = Path.Combine(folder, $".{FileName}.{System.Environment.ProcessId}.tmp");
        File.WriteAllText(temp, JsonSerializer.Serialize(this, Options) + "\n");
        File.Move(temp, Path.Combine(folder, FileName), overwrite: true);
    }

    /// <summary>The mark of a folder, or null when it has none or one that does not read.</summary>
    public static OutputMarker? Read(string folder)
    {
        string file = Path.Combine(folder, FileName);
        if (!File.Exists(file)) return null;
        try
        {
            var m = JsonSerializer.Deserialize<OutputMarker>(File.ReadAllText(file), Options);
            return m is { Schema: SchemaId, Files: not null, Kind: not null } ? m : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }

    /// <summary>The first entry of <paramref name="folder"/> the mark does not account for, or null when it accounts for all.</summary>
    public string? FirstForeignEntry(string folder)
    {
        var files = Files.ToHashSet(StringComparer.Ordinal);
        files.Add(FileName);
        var owned = Folders.ToList();
        foreach (string entry in Directory.EnumerateFileSystemEntries(folder, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            string rel = Path.GetRelativePath(folder, entry).Replace('\\', '/');
            bool isDir = Directory.Exists(entry);
            if (new FileInfo(entry).LinkTarget is not null) return rel;
            if (owned.Any(o => rel == o || rel.StartsWith(o + "/", StringComparison.Ordinal))) continue;
            if (isDir ? files.Any(f => f.StartsWith(rel + "/", StringComparison.Ordinal)) : files.Contains(rel)) continue;
            return rel;
        }
        return null;
    }
}
