namespace MpptArena.Cli;

/// <summary>
/// A small command-line reader: positional arguments, "--name value" options (repeatable), and
/// "--flag" switches. Anything not declared by the command is an error with the list of what is.
/// </summary>
internal sealed class ArgumentReader
{
    private readonly List<string> _positional = [];
    private readonly Dictionary<string, List<string>> _options = new(StringComparer.Ordinal);
    private readonly HashSet<string> _flags = new(StringComparer.Ordinal);

    /// <summary>Reads <paramref name="args"/> for a command that takes the given options and flags.</summary>
    public ArgumentReader(IEnumerable<string> args, string command, IReadOnlyCollection<string> options, IReadOnlyCollection<string> flags)
    {
        using var e = args.GetEnumerator();
        while (e.MoveNext())
        {
            string a = e.Current;
            if (a.StartsWith("--", StringComparison.Ordinal))
            {
                string name = a, value = "";
                int eq = a.IndexOf('=');
                bool inline = eq > 0;
                if (inline) { name = a[..eq]; value = a[(eq + 1)..]; }
                if (flags.Contains(name) && !inline)
                {
                    _flags.Add(name);
                    continue;
                }
                if (!options.Contains(name))
                {
                    var known = options.Concat(flags).OrderBy(x => x, StringComparer.Ordinal);
                    throw new ArenaInputException($"'{command}' does not take '{name}'; it takes: {string.Join(", ", known)}", name);
                }
                if (!inline)
                {
                    if (!e.MoveNext()) throw new ArenaInputException($"option '{name}' needs a value", name);
                    value = e.Current;
                }
                if (!_options.TryGetValue(name, out var list)) _options[name] = list = [];
                list.Add(value);
            }
            else
            {
                _positional.Add(a);
            }
        }
    }

    /// <summary>Positional arguments.</summary>
    public IReadOnlyList<string> Positional => _positional;

    /// <summary>True if a flag was given.</summary>
    public bool Flag(string name) => _flags.Contains(name);

    /// <summary>The last value of an option, or null.</summary>
    public string? Option(string name) => _options.TryGetValue(name, out var l) ? l[^1] : null;

    /// <summary>Every value of a repeatable option.</summary>
    public IReadOnlyList<string> Options(string name) => _options.TryGetValue(name, out var l) ? l : [];

    /// <summary>Exactly <paramref name="count"/> positional arguments, or an error naming them.</summary>
    public void RequirePositional(int count, string usage)
    {
        if (_positional.Count != count) throw new ArenaInputException($"usage: {usage}", "arguments");
    }

    /// <summary>--threads N (a whole number of at least 1), or <paramref name="fallback"/> when it is not given.</summary>
    public int Threads(int fallback) => Option("--threads") is { } t
        ? (int.TryParse(t, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int n) && n >= 1
            ? n : throw new ArenaInputException($"--threads '{t}' must be a whole number of at least 1", "--threads"))
        : fallback;
}
