using MpptArena.Cli.Terminal;
using MpptArena.Reports.Output;
using MpptArena.Reports.Sweeps;

namespace MpptArena.Cli.Commands;

/// <summary>mppt-arena merge SHARD_DIR... --out DIR: joins the shards of one sweep into the result a single machine would have written.</summary>
internal static class MergeCommand
{
    public static int Execute(string[] args)
    {
        var a = new ArgumentReader(args, "merge", ["--out"], ["--no-plots", "--force"]);
        if (a.Positional.Count == 0 || a.Option("--out") is null) throw new ArenaInputException("usage: mppt-arena merge SHARD_DIR... --out DIR [--force] [--no-plots]", "arguments");
        string requested = a.Option("--out")!;
        string target = OutputTarget.FullPath(requested);
        foreach (string input in a.Positional)
        {
            string full = OutputTarget.FullPath(input, "shard folder");
            if (OutputTarget.IsSameOrInside(full, target) || OutputTarget.IsSameOrInside(target, full))
            {
                throw new ArenaInputException($"--out '{requested}' is, holds or lies inside the shard folder '{input}'; the merged result goes to a folder of its own", "--out");
            }
        }
        var manifests = a.Positional.Select(d => (Dir: d, Manifest: SweepStore.ReadManifest(d))).ToList();
        var first = manifests[0].Manifest;
        foreach (var (dir, m) in manifests)
        {
            if (m.SweepDigest != first.SweepDigest || m.ShardCount != first.ShardCount)
            {
                string what = m.Name != first.Name || m.ShardCount != first.ShardCount ? "another sweep or sharding" : $"other inputs ({SweepStore.DescribeChange(first, m.Inputs)})";
                throw new ArenaInputException($"'{dir}' is from {what} than '{manifests[0].Dir}': {m.Name}, {m.ShardCount} shards, digest {m.SweepDigest} against {first.Name}, {first.ShardCount} shards, digest {first.SweepDigest}; shards of one result must be run from the same inputs and tool build", "folder");
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
        using var stage = StagedOutput.Begin(requested, "merge", a.Flag("--force"));
        string output = stage.StagingPath;
        foreach (var r in cases.Values) SweepStore.Write(output, r);
        SweepStore.WriteManifest(output, first with { Shard = 1, ShardCount = 1, ShardCases = first.TotalCases });
        SweepReport.Write(output, cases.Values, first.Objective, first.HeatmapX, first.HeatmapY, !a.Flag("--no-plots"));
        StandardOutput.Out.WriteLine($"{first.Name}: merged {cases.Count} cases from {manifests.Count} shard folder(s)");
        StandardOutput.Out.WriteLine($"results: {ShownPath.Of(stage.Commit([SweepStore.CasesFolderName]))}");
        return ExitCodes.Ok;
    }
}
