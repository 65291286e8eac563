using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace MpptArena.Sweeps;

/// <summary>One run of a sweep: one scenario, one tracker with concrete settings.</summary>
/// <param name="ScenarioIndex">Index of the scenario in the sweep's suite.</param>
/// <param name="ScenarioName">Scenario name.</param>
/// <param name="TrackerName">Tracker name.</param>
/// <param name="Kind">Tracker kind.</param>
/// <param name="PeriodMs">Sample period [ms].</param>
/// <param name="Parameters">Parameter values, sorted by name.</param>
/// <param name="InputDigest">Digest of the inputs behind the case: tool build, scenario inputs, tracker code (<see cref="SweepPlanner.InputDigestOf"/>).</param>
/// <param name="Seed">The seed of this case when its scenario runs over several seeds (one case per seed); null when it runs over one.</param>
public sealed record SweepCase(int ScenarioIndex, string ScenarioName, string TrackerName, string Kind, double PeriodMs, IReadOnlyList<KeyValuePair<string, double>> Parameters, string InputDigest,
    ulong? Seed = null)
{
    /// <summary>The case's identity as text: scenario, tracker, period and parameters with round-trip numbers, and the inputs' digest.</summary>
    public string Key => string.Create(CultureInfo.InvariantCulture,
        $"{ScenarioName}|{TrackerName}|{Kind}|period_ms={PeriodMs:R}|{string.Join(",", Parameters.Select(p => $"{p.Key}={p.Value:R}"))}|inputs={InputDigest}{(Seed is { } seed ? $"|seed={seed}" : "")}");

    /// <summary>The settings part of the key (everything but the scenario), to group a setting across scenarios.</summary>
    public string SettingKey => string.Create(CultureInfo.InvariantCulture,
        $"{TrackerName}|period_ms={PeriodMs:R}|{string.Join(",", Parameters.Select(p => $"{p.Key}={p.Value:R}"))}");

    /// <summary>A stable identifier: the first 16 hex digits of SHA-256 of <see cref="Key"/>.</summary>
    public string Id => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(Key)))[..16];

    /// <summary>The shard (1..N) this case belongs to: its identifier taken as a number, modulo N, plus one.</summary>
    public int ShardOf(int shardCount) => (int)(ulong.Parse(Id, NumberStyles.HexNumber, CultureInfo.InvariantCulture) % (ulong)shardCount) + 1;
}
