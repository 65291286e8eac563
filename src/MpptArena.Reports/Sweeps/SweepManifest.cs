namespace MpptArena.Reports.Sweeps;

/// <summary>sweep.json: what a sweep output folder holds.</summary>
public sealed record SweepManifest
{
    /// <summary>Schema identifier.</summary>
    public const string SchemaId = "mppt-arena/sweep/1";

    /// <summary>Schema identifier.</summary>
    public required string Schema { get; init; }

    /// <summary>Sweep name.</summary>
    public required string Name { get; init; }

    /// <summary>Digest of every case key of the whole sweep: shards of one sweep share it.</summary>
    public required string SweepDigest { get; init; }

    /// <summary>Digest of each input the results depend on ("tool", "scenario NAME", "tracker NAME"); part of every case's identity.</summary>
    public SortedDictionary<string, string> Inputs { get; init; } = new(StringComparer.Ordinal);

    /// <summary>Cases in the whole sweep.</summary>
    public required int TotalCases { get; init; }

    /// <summary>This folder's shard, 1-based.</summary>
    public required int Shard { get; init; }

    /// <summary>Number of shards.</summary>
    public required int ShardCount { get; init; }

    /// <summary>Cases of this shard.</summary>
    public required int ShardCases { get; init; }

    /// <summary>Score the best-settings tables rank by.</summary>
    public required string Objective { get; init; }

    /// <summary>Heat map x axis, or null for the first swept one.</summary>
    public string? HeatmapX { get; init; }

    /// <summary>Heat map y axis, or null for the second swept one.</summary>
    public string? HeatmapY { get; init; }
}
