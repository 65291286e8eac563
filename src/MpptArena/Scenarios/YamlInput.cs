using YamlDotNet.Core;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// The one way the arena reads a YAML file: bounded in size and nesting, a single document, no tags
/// beyond YAML's own, every alias defined; each refusal names the file, line and column.
/// </summary>
public static class YamlInput
{
    /// <summary>Largest input file read [bytes]: far above any scenario, below what could exhaust memory.</summary>
    public const long MaxFileBytes = 16L << 20;

    /// <summary>Deepest nesting of mappings and sequences (a scenario needs about 8).</summary>
    public const int MaxDepth = 64;

    /// <summary>Most aliases in one document (each can stand for a large subtree).</summary>
    public const int MaxAliases = 1000;

    /// <summary>Reads a text input file of at most <see cref="MaxFileBytes"/>; <paramref name="what"/> names it in messages ("scenario file").</summary>
    public static string ReadText(string path, string what)
    {
        if (Directory.Exists(path)) throw new ArenaInputException($"{what} '{path}' is a folder; name a file", "file");
        if (!File.Exists(path)) throw new ArenaInputException($"{what} '{path}' not found", "file");
        long length = new FileInfo(path).Length;
        if (length > MaxFileBytes)
        {
            throw new ArenaInputException($"{what} '{path}' is {length / 1048576.0:0.#} MiB; the limit is {MaxFileBytes >> 20} MiB", "file", new SourceLocation(path, 1, 1));
        }
        try
        {
            return File.ReadAllText(path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new ArenaInputException($"{what} '{path}' cannot be read: {ex.Message}", "file");
        }
    }

    /// <summary>The root node of the single document in <paramref name="yaml"/>; <paramref name="file"/> is used in messages.</summary>
    /// <param name="yaml">The text.</param>
    /// <param name="file">File name for messages.</param>
    /// <param name="expected">What the root should be, for the message on an empty file ("a scenario mapping").</param>
    public static YamlNode ReadRoot(string yaml, string file, string expected)
    {
        if (yaml.Length > MaxFileBytes) throw new ArenaInputException($"the text is longer than the {MaxFileBytes >> 20} MiB limit", "file", new SourceLocation(file, 1, 1));
        Check(yaml, file);
        var stream = new YamlStream();
        try
        {
            stream.Load(new StringReader(yaml));
        }
        catch (YamlException ex)
        {
            throw Error(ex, file);
        }
        if (stream.Documents.Count == 0) throw new ArenaInputException($"the file is empty: expected {expected}", null, new SourceLocation(file, 1, 1));
        return stream.Documents[0].RootNode;
    }

    /// <summary>Walks the event stream once, without building nodes, and refuses what the loader must not see.</summary>
    private static void Check(string yaml, string file)
    {
        var parser = new Parser(new StringReader(yaml));
        var anchors = new HashSet<string>(StringComparer.Ordinal);
        int depth = 0, documents = 0, aliases = 0;
        long lastLine = 1, lastColumn = 1;
        try
        {
            while (parser.MoveNext())
            {
                var e = parser.Current!;
                (lastLine, lastColumn) = (e.End.Line, e.End.Column);
                var at = new SourceLocation(file, e.Start.Line, e.Start.Column);
                switch (e)
                {
                    case DocumentStart:
                        if (++documents > 1) throw new ArenaInputException("a second YAML document ('---'); the file must hold exactly one", null, at);
                        break;
                    case MappingStart or SequenceStart:
                        if (++depth > MaxDepth) throw new ArenaInputException($"nested more than {MaxDepth} levels deep", null, at);
                        break;
                    case MappingEnd or SequenceEnd:
                        depth--;
                        break;
                    case AnchorAlias alias:
                        if (!anchors.Contains(alias.Value.Value)) throw new ArenaInputException($"alias '*{alias.Value.Value}' names no anchor defined before it", null, at);
                        if (++aliases > MaxAliases) throw new ArenaInputException($"more than {MaxAliases} aliases", null, at);
                        break;
                }
                if (e is NodeEvent node)
                {
                    if (!node.Anchor.IsEmpty) anchors.Add(node.Anchor.Value);
                    if (!node.Tag.IsEmpty && !node.Tag.IsNonSpecific && !node.Tag.Value.StartsWith("tag:yaml.org,2002:", StringComparison.Ordinal))
                    {
                        throw new ArenaInputException($"unknown tag '{node.Tag.Value}'; the arena reads plain YAML values (drop the tag)", null, at);
                    }
                }
            }
        }
        catch (YamlException ex)
        {
            throw Error(ex, file);
        }
        catch (InvalidOperationException)
        {
            // The YAML scanner gives up without a position on some unterminated flow collections.
            throw new ArenaInputException("not valid YAML after this point: a '{ }' or '[ ]' that is not closed, or a value that cannot be read", null, new SourceLocation(file, lastLine, lastColumn));
        }
    }

    private static ArenaInputException Error(YamlException ex, string file)
    {
        string reason = ex.InnerException?.Message ?? ex.Message;
        int colon = reason.IndexOf("): ", StringComparison.Ordinal);
        if (colon >= 0) reason = reason[(colon + 3)..];
        return new ArenaInputException($"not valid YAML: {reason}", null, new SourceLocation(file, ex.Start.Line, ex.Start.Column));
    }
}
