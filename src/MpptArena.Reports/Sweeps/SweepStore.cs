using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using MpptArena.Reports.Summary;
using MpptArena.Runs;
using MpptArena.Sweeps;

namespace MpptArena.Reports.Sweeps;

/// <summary>
/// The case files of a sweep output folder. Each case is written atomically (a temporary file renamed
/// into place) as it finishes, so an interrupted sweep leaves only whole files, and a resumed sweep
/// skips every case whose file reads back.
/// </summary>
public static class SweepStore
{
    /// <summary>Name of the folder of case files inside an output folder.</summary>
    public const string CasesFolderName = "cases";

    /// <summary>Folder of case files inside an output folder.</summary>
    public static string CasesFolder(string output) => Path.Combine(output, CasesFolderName);

    /// <summary>The stored form of a finished case.</summary>
    public static SweepCaseResult ToResult(SweepCase c, RunResult run)
    {
        var t = run.Trackers.Single();
        return new SweepCaseResult
        {
            CaseId = c.Id,
            Scenario = c.ScenarioName,
            Seed = c.Seed,
            Tracker = c.TrackerName,
            Kind = c.Kind,
            PeriodMs = c.PeriodMs,
            Parameters = new SortedDictionary<string, double>(c.Parameters.ToDictionary(kv => kv.Key, kv => kv.Value), StringComparer.Ordinal),
            Failed = t.Failure is not null,
            FailureReason = t.Failure?.Reason,
            Scores = t.Scores is null ? new SortedDictionary<string, double?>(StringComparer.Ordinal) : ScoreCatalog.ToDictionary(t.Scores),
        };
    }

    /// <summary>Writes one case atomically.</summary>
    public static void Write(string output, SweepCaseResult result)
    {
        string folder = CasesFolder(output);
        Directory.CreateDirectory(folder);
        string final = Path.Combine(folder, result.CaseId + ".json");
        string temp = Path.Combine(folder, $".{result.CaseId}.{System.Environment.ProcessId}.{System.Environment.CurrentManagedThreadId}.tmp");
        File.WriteAllText(temp, JsonSerializer.Serialize(result, SummaryJson.Options) + "\n");
        File.Move(temp, final, overwrite: true);
    }

    /// <summary>Every whole case file in an output folder, by case id; unreadable or partial files are ignored (they are rerun).</summary>
    public static Dictionary<string, SweepCaseResult> ReadAll(string output)
    {
        var map = new Dictionary<string, SweepCaseResult>(StringComparer.Ordinal);
        string folder = CasesFolder(output);
        if (!Directory.Exists(folder)) return map;
        foreach (string file in Directory.GetFiles(folder, "*.json"))
        {
            try
            {
                var r = JsonSerializer.Deserialize<SweepCaseResult>(File.ReadAllText(file), SummaryJson.Options);
                if (r is not null && Path.GetFileNameWithoutExtension(file) == r.CaseId) map[r.CaseId] = r;
            }
            catch (JsonException)
            {
                // A file that does not parse is treated as not done.
            }
        }
        return map;
    }

    /// <summary>Removes every case file whose id is not in <paramref name="keep"/> (results of inputs that changed); returns how many.</summary>
    public static int RemoveExcept(string output, IReadOnlySet<string> keep)
    {
        string folder = CasesFolder(output);
        if (!Directory.Exists(folder)) return 0;
        int removed = 0;
        foreach (string file in Directory.GetFiles(folder, "*.json"))
        {
            if (keep.Contains(Path.GetFileNameWithoutExtension(file))) continue;
            File.Delete(file);
            removed++;
        }
        return removed;
    }

    /// <summary>Digest identifying the whole sweep: SHA-256 over its sorted case keys.</summary>
    public static string Digest(IReadOnlyList<SweepCase> allCases) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(string.Join("\n", allCases.Select(c => c.Key).Order(StringComparer.Ordinal)))))[..16];

    /// <summary>What differs between the inputs a manifest records and <paramref name="now"/>, in words ("scenario a changed, tracker b is new").</summary>
    public static string DescribeChange(SweepManifest before, IReadOnlyDictionary<string, string> now)
    {
        var words = new List<string>();
        foreach (var (k, v) in now)
        {
            if (!before.Inputs.TryGetValue(k, out string? old)) words.Add($"{k} is new");
            else if (old != v) words.Add(k == "tool" ? $"the tool build changed ({old} -> {v})" : $"{k} changed");
        }
        words.AddRange(before.Inputs.Keys.Where(k => !now.ContainsKey(k)).Select(k => $"{k} is gone"));
        return words.Count > 0 ? string.Join(", ", words) : "the cases differ (axes, settings or sampling)";
    }

    /// <summary>Writes sweep.json.</summary>
    public static void WriteManifest(string output, SweepManifest manifest) =>
        File.WriteAllText(Path.Combine(output, "sweep.json"), JsonSerializer.Serialize(manifest, SummaryJson.Options) + "\n");

    /// <summary>Reads sweep.json of an output folder.</summary>
    public static SweepManifest ReadManifest(string output)
    {
        string file = Path.Combine(output, "sweep.json");
        if (!File.Exists(file)) throw new ArenaInputException($"'{output}' is not a sweep output folder (no sweep.json)", "folder");
        try
        {
            var m = JsonSerializer.Deserialize<SweepManifest>(File.ReadAllText(file), SummaryJson.Options);
            if (m is null || m.Schema != SweepManifest.SchemaId) throw new ArenaInputException($"'{file}' is not a sweep manifest of schema {SweepManifest.SchemaId}", "schema", new SourceLocation(file, 1, 1));
            return m;
        }
        catch (JsonException ex)
        {
            throw new ArenaInputException($"not a valid sweep manifest: {JsonErrorText.Describe(ex)}", null, new SourceLocation(file, (ex.LineNumber ?? 0) + 1, (ex.BytePositionInLine ?? 0) + 1));
        }
    }
}
