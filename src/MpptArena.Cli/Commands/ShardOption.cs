using System.Globalization;

namespace MpptArena.Cli.Commands;

/// <summary>
/// Which shard K of N to run: from --shard K/N, else from the index variables of the batch system that
/// started the process: Kubernetes Indexed Jobs (JOB_COMPLETION_INDEX, 0-based, with the shard count in
/// MPPT_ARENA_SHARD_COUNT since Kubernetes does not export it) or Slurm job arrays (SLURM_ARRAY_TASK_ID,
/// SLURM_ARRAY_TASK_MIN, SLURM_ARRAY_TASK_COUNT). Without any of them: the whole sweep (1/1).
/// </summary>
internal static class ShardOption
{
    public static (int Shard, int Count, string Source) Resolve(string? option, Func<string, string?> env)
    {
        if (option is not null) return Parse(option, "--shard");
        if (env("JOB_COMPLETION_INDEX") is { } k8s)
        {
            int index = Int(k8s, "JOB_COMPLETION_INDEX");
            string count = env("MPPT_ARENA_SHARD_COUNT")
                           ?? throw new ArenaInputException("JOB_COMPLETION_INDEX is set (Kubernetes Indexed Job) but MPPT_ARENA_SHARD_COUNT is not: set it to the Job's completions", "MPPT_ARENA_SHARD_COUNT");
            return Check(index + 1, Int(count, "MPPT_ARENA_SHARD_COUNT"), $"Kubernetes Indexed Job: JOB_COMPLETION_INDEX={k8s}, MPPT_ARENA_SHARD_COUNT={count}");
        }
        if (env("SLURM_ARRAY_TASK_ID") is { } slurm)
        {
            int id = Int(slurm, "SLURM_ARRAY_TASK_ID");
            string minText = env("SLURM_ARRAY_TASK_MIN") ?? "0";
            int min = Int(minText, "SLURM_ARRAY_TASK_MIN");
            string countText = env("SLURM_ARRAY_TASK_COUNT")
                               ?? throw new ArenaInputException($"SLURM_ARRAY_TASK_ID={slurm} is set but SLURM_ARRAY_TASK_COUNT is not; pass --shard \"$SLURM_ARRAY_TASK_ID/N\" with N the number of shards", "--shard");
            int count = Int(countText, "SLURM_ARRAY_TASK_COUNT");
            string seen = $"SLURM_ARRAY_TASK_ID={slurm}, SLURM_ARRAY_TASK_MIN={minText}, SLURM_ARRAY_TASK_COUNT={countText}";
            string? maxText = env("SLURM_ARRAY_TASK_MAX");
            // A lone task (a rerun with --array=4) or a sparse array (--array=1,4,9) does not tell the shard
            // count: the array's own numbers would silently name another sharding.
            if (count == 1 || (maxText is not null && Int(maxText, "SLURM_ARRAY_TASK_MAX") - min + 1 != count))
            {
                throw new ArenaInputException(
                    $"the Slurm array ({seen}{(maxText is null ? "" : $", SLURM_ARRAY_TASK_MAX={maxText}")}) is not the whole sharding 1..N, so it does not say which shard of how many this task is; " +
                    $"pass it explicitly: --shard \"$SLURM_ARRAY_TASK_ID/N\" (here {id}/N) with N the shard count of the sweep", "--shard");
            }
            return Check(id - min + 1, count, $"Slurm job array: {seen}");
        }
        return (1, 1, "whole sweep");
    }

    private static (int, int, string) Parse(string text, string option)
    {
        var parts = text.Split('/');
        if (parts.Length != 2) throw new ArenaInputException($"{option} '{text}' must look like K/N, e.g. 2/8", option);
        return Check(Int(parts[0], option), Int(parts[1], option), option);
    }

    private static (int, int, string) Check(int k, int n, string source)
    {
        if (n < 1 || k < 1 || k > n) throw new ArenaInputException($"shard {k}/{n} from {source} is not valid: K must be from 1 to N", "--shard");
        return (k, n, source);
    }

    private static int Int(string text, string name) =>
        int.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out int v) ? v : throw new ArenaInputException($"{name} '{text}' is not a whole number", name);
}
