namespace MpptArena.Arrays;

/// <summary>
/// Substring tables kept across curve preparations: when conditions return to a state seen before (a
/// shadow edge moving on, a substring leaving the shade), its table is reused instead of rebuilt. Keyed
/// by the exact substring model and current range; bounded in size (cleared when full).
/// </summary>
public sealed class SubstringTableCache
{
    private readonly Dictionary<(SubstringModel Model, double Low, double High, double Tolerance), SubstringTable> _tables = [];
    private readonly int _capacity;

    /// <summary>A cache of at most <paramref name="capacity"/> tables.</summary>
    public SubstringTableCache(int capacity = 1024) => _capacity = capacity;

    /// <summary>Tables built so far (misses).</summary>
    public int Built { get; private set; }

    /// <summary>Tables reused (hits).</summary>
    public int Reused { get; private set; }

    internal SubstringTable Get(in SubstringModel model, double low, double high, double tolerance)
    {
        var key = (model, low, high, tolerance);
        if (_tables.TryGetValue(key, out var table))
        {
            Reused++;
            return table;
        }
        if (_tables.Count >= _capacity) _tables.Clear();
        table = new SubstringTable(model, low, high, tolerance);
        _tables[key] = table;
        Built++;
        return table;
    }
}
