namespace MpptArena.Arrays;

/// <summary>
/// Values computed once per key and kept, at most <c>capacity</c> of them (emptied when full). Holds only
/// pure functions of their keys, so what it happens to hold never changes a result.
/// </summary>
internal sealed class BoundedMemo<TKey, TValue>(int capacity) where TKey : notnull
{
    private readonly Dictionary<TKey, TValue> _values = [];

    /// <summary>Values computed (misses).</summary>
    public int Built { get; private set; }

    /// <summary>Values served from the memo (hits).</summary>
    public int Reused { get; private set; }

    /// <summary>The value for <paramref name="key"/>, computed by <paramref name="compute"/> on a miss.</summary>
    public TValue Get<TState>(TKey key, TState state, Func<TState, TValue> compute)
    {
        if (_values.TryGetValue(key, out var value))
        {
            Reused++;
            return value;
        }
        if (_values.Count >= capacity) _values.Clear();
        value = compute(state);
        _values[key] = value;
        Built++;
        return value;
    }
}
