using System.Security.Cryptography;
using System.Text;
using YamlDotNet.RepresentationModel;

namespace MpptArena.Scenarios;

/// <summary>
/// Short SHA-256 digests of what a result depends on: a document as loaded (its nodes, not its comments or
/// layout), the bytes of a file it reads, a list of such parts.
/// </summary>
public static class ContentDigest
{
    /// <summary>Hex digits kept of the SHA-256: 64 bits, ample to tell versions of one input apart.</summary>
    public const int Length = 16;

    /// <summary>Digest of text.</summary>
    public static string OfText(string text) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text)))[..Length];

    /// <summary>Digest of a file's bytes.</summary>
    public static string OfFile(string path)
    {
        using var stream = File.OpenRead(path);
        return Convert.ToHexStringLower(SHA256.HashData(stream))[..Length];
    }

    /// <summary>Digest of a YAML node tree as loaded: keys, values and structure; comments and formatting do not count.</summary>
    public static string OfYaml(YamlNode root)
    {
        var sb = new StringBuilder();
        Append(root, sb);
        return OfText(sb.ToString());
    }

    /// <summary>Digest of named parts, in the given order.</summary>
    public static string OfParts(IEnumerable<string> parts) => OfText(string.Join("\n", parts));

    private static void Append(YamlNode node, StringBuilder sb)
    {
        switch (node)
        {
            case YamlScalarNode s:
                sb.Append('s').Append(s.Value?.Length ?? -1).Append(':').Append(s.Value);
                break;
            case YamlSequenceNode q:
                sb.Append('[');
                foreach (var c in q.Children) Append(c, sb);
                sb.Append(']');
                break;
            case YamlMappingNode m:
                sb.Append('{');
                foreach (var (k, v) in m.Children)
                {
                    Append(k, sb);
                    Append(v, sb);
                }
                sb.Append('}');
                break;
        }
    }
}
