namespace MpptArena.Trackers;

/// <summary>Parameter values of one tracker instance, checked against its declared parameters.</summary>
public sealed class TrackerSettings
{
    private readonly Dictionary<string, double> _values;

    /// <summary>Values completed with defaults for every declared parameter.</summary>
    /// <param name="declared">The tracker's declared parameters.</param>
    /// <param name="given">Values set by the user.</param>
    /// <exception cref="ArenaInputException">A name is not declared, or a value is out of range.</exception>
    public TrackerSettings(IReadOnlyList<TrackerParameter> declared, IReadOnlyDictionary<string, double> given)
    {
        _values = declared.ToDictionary(p => p.Name, p => p.Default);
        foreach (var (name, value) in given)
        {
            var p = declared.FirstOrDefault(d => d.Name == name)
                    ?? throw new ArenaInputException(
                        $"unknown parameter '{name}'; this tracker declares: {string.Join(", ", declared.Select(d => d.Name))}", name);
            if (!double.IsFinite(value) || value < p.Min || value > p.Max)
            {
                throw new ArenaInputException($"parameter '{name}' = {value} is outside its range [{p.Min}, {p.Max}] {p.Unit}", name);
            }
            _values[name] = value;
        }
    }

    /// <summary>Value of a declared parameter.</summary>
    public double this[string name] => _values[name];

    /// <summary>All values by name, sorted by name.</summary>
    public IReadOnlyList<KeyValuePair<string, double>> All => _values.OrderBy(kv => kv.Key, StringComparer.Ordinal).ToList();
}
