namespace MpptArena.Arrays;

/// <summary>
/// Substring tables kept across curve preparations: when conditions return to a state seen before (a
/// shadow edge moving on, a substring leaving the shade), its table is reused instead of rebuilt. Keyed
/// by the exact substring model and current range; bounded in size (cleared when full).
/// </summary>
public sealed class SubstringTableCache
{
    private readonly BoundedMemo<(SubstringModel Model, double Low, double High, double Tolerance), SubstringTable> _tables;

    /// <summary>A cache of at most <paramref name="capacity"/> tables.</summary>
    public SubstringTableCache(int capacity = 1024) => _tables = new(capacity);

    /// <summary>Tables built so far (misses).</summary>
    public int Built => _tables.Built;

    /// <summary>Tables reused (hits).</summary>
    public int Reused => _tables.Reused;

    internal SubstringTable Get(in SubstringModel model, double low, double high, double tolerance) =>
        _tables.Get((model, low, high, tolerance), (model, low, high, tolerance), k => new SubstringTable(k.model, k.low, k.high, k.tolerance));
}
