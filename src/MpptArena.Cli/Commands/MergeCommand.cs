using MpptArena.Cli.Terminal;
using MpptArena.Reports.Sweeps;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena merge SHARD_DIR... --out DIR: joins the shards of one sweep into the result a single machine would have written.</summary>
internal static class MergeCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "merge", ["--out"], ["--no-plots"]);
        if (a.Positional.Count == 0 || a.Option("--out") is null) throw new ArenaInputException("usage: mppt-arena merge SHARD_DIR... --out DIR", "arguments");
        string output = a.Option("--out")!;
        var manifests = a.Positional.Select(d => (Dir: d, Manifest: SweepStore.ReadManifest(d))).ToList();
        var first = manifests[0].Manifest;
        foreach (var (dir, m) in manifests)
        {
            if (m.SweepDigest != first.SweepDigest || m.ShardCount != first.ShardCount)
            {
                throw new ArenaInputException($"'{dir}' is from another sweep or sharding ({m.Name}, {m.ShardCount} shards, digest {m.SweepDigest}) than '{manifests[0].Dir}' ({first.Name}, {first.ShardCount} shards, digest {first.SweepDigest})", "folder");
            }
        }
        var cases = new Dictionary<string, SweepCaseResult>(StringComparer.Ordinal);
        foreach (var (dir, _) in manifests)
        {
            foreach (var (id, r) in SweepStore.ReadAll(dir)) cases[id] = r;
        }
        if (cases.Count != first.TotalCases)
        {
            var present = manifests.Select(m => m.Manifest.Shard).ToHashSet();
            var absent = Enumerable.Range(1, first.ShardCount).Where(k => !present.Contains(k)).ToList();
            throw new ArenaInputException($"the shards hold {cases.Count} of the sweep's {first.TotalCases} cases" +
                (absent.Count > 0 ? $"; shards not given: {string.Join(", ", absent)}" : "; some shards are unfinished: rerun them with the same --out to resume"), "folder");
        }
        Directory.CreateDirectory(output);
        foreach (var r in cases.Values) SweepStore.Write(output, r);
        SweepStore.WriteManifest(output, first with { Shard = 1, ShardCount = 1, ShardCases = first.TotalCases });
        SweepReport.Write(output, cases.Values, first.Objective, first.HeatmapX, first.HeatmapY, !a.Flag("--no-plots"));
        StandardOutput.Out.WriteLine($"{first.Name}: merged {cases.Count} cases from {manifests.Count} shard folder(s)");
        StandardOutput.Out.WriteLine($"results: {output}");
        return ExitCodes.Ok;
    }
}
