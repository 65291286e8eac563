namespace MpptArena.Trackers.Isolation;

/// <summary>What a tracker under test may use before it is stopped and reported as failed.</summary>
/// <param name="CallS">Wall time one call (create, step, destroy) may take [s].</param>
/// <param name="RunS">Wall time all calls of one run may take together [s].</param>
/// <param name="MemoryBytes">Resident memory of the tracker's host process [bytes].</param>
public sealed record TrackerLimits(double CallS, double RunS, long MemoryBytes)
{
    /// <summary>Defaults no sane tracker reaches: 1 s a call, 600 s a run, 512 MiB.</summary>
    public static TrackerLimits Default { get; } = new(1.0, 600.0, 512L << 20);

    /// <summary>How long a host may take to start and say HELLO [s] (a cold .NET start on a loaded machine takes well under a second).</summary>
    public const double StartS = 30.0;

    /// <summary>The memory limit in MiB, for messages.</summary>
    public double MemoryMiB => MemoryBytes / 1048576.0;
}
