namespace MpptArena.Arrays;

/// <summary>
/// Prepared string curves kept across curve preparations: a string whose substrings all kept their
/// conditions (the unshaded string while a shadow crosses its neighbour) is not tabulated again. Keyed by
/// the string's exact substring models, their counts, its blocking diode and the tabulation range and
/// tolerances, so a reused curve is the very curve a fresh tabulation gives; bounded (cleared when full).
/// </summary>
public sealed class StringCurveCache
{
    private readonly BoundedMemo<Key, PreparedStringCurve> _curves;

    /// <summary>A cache of at most <paramref name="capacity"/> string curves.</summary>
    public StringCurveCache(int capacity = 256) => _curves = new(capacity);

    /// <summary>String curves tabulated so far (misses).</summary>
    public int Built => _curves.Built;

    /// <summary>String curves reused (hits).</summary>
    public int Reused => _curves.Reused;

    internal PreparedStringCurve Get(StringModel model, double low, double high, double substringTolerance, SubstringTableCache? tables) =>
        _curves.Get(new Key(model, low, high, substringTolerance), (model, low, high, substringTolerance, tables),
            a => new PreparedStringCurve(a.model, a.low, a.high, a.substringTolerance, a.tables));

    private sealed class Key : IEquatable<Key>
    {
        private readonly SubstringModel[] _substrings;
        private readonly int[] _counts;
        private readonly (double, double, double, double, double) _scalars;
        private readonly int _hash;

        public Key(StringModel model, double low, double high, double substringTolerance)
        {
            _substrings = [.. model.DistinctSubstrings];
            _counts = [.. model.Counts];
            var (saturation, ideality) = model.BlockingDiode;
            _scalars = (saturation, ideality, low, high, substringTolerance);
            var hash = new HashCode();
            foreach (var s in _substrings) hash.Add(s);
            foreach (int c in _counts) hash.Add(c);
            hash.Add(_scalars);
            _hash = hash.ToHashCode();
        }

        public bool Equals(Key? other) =>
            other is not null && _hash == other._hash && _scalars == other._scalars
            && _counts.AsSpan().SequenceEqual(other._counts) && _substrings.AsSpan().SequenceEqual(other._substrings);

        public override bool Equals(object? obj) => Equals(obj as Key);

        public override int GetHashCode() => _hash;
    }
}
