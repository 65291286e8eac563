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
            return Check(index + 1, Int(count, "MPPT_ARENA_SHARD_COUNT"), "Kubernetes Indexed Job");
        }
        if (env("SLURM_ARRAY_TASK_ID") is { } slurm)
        {
            int id = Int(slurm, "SLURM_ARRAY_TASK_ID");
            int min = env("SLURM_ARRAY_TASK_MIN") is { } m ? Int(m, "SLURM_ARRAY_TASK_MIN") : 0;
            string count = env("SLURM_ARRAY_TASK_COUNT")
                           ?? throw new ArenaInputException("SLURM_ARRAY_TASK_ID is set but SLURM_ARRAY_TASK_COUNT is not; pass --shard K/N", "--shard");
            return Check(id - min + 1, Int(count, "SLURM_ARRAY_TASK_COUNT"), "Slurm job array");
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
