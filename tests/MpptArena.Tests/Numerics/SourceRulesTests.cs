using System.Text.RegularExpressions;

namespace MpptArena.Tests.Numerics;

public class SourceRulesTests
{
    [Fact]
    public void TheLibraryCallsNoPlatformTranscendentalFunctions()
    {
        // The platform's exp, log, sin and cos differ in last bits between C libraries and processors
        // (glibc's own manual lists its functions' errors in ulps per architecture), and fused multiply-add
        // rounds once where other hardware rounds twice; either would make a seed give different numbers on
        // different machines. Only Numerics/PortableMath may name them (for its documented fallback).
        var forbidden = new Regex(@"(?<![\w.])(Math|MathF|double)\.(Exp|ExpM1|Exp2|Exp10|Log|Log2|Log10|LogP1|Pow|Sin|Cos|Tan|SinCos|Asin|Acos|Atan|Atan2|Sinh|Cosh|Tanh|Cbrt|FusedMultiplyAdd)\s*\(");
        string library = Path.Combine(RepoRoot.Path, "src", "MpptArena");
        var offences = Directory.EnumerateFiles(library, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}") && Path.GetFileName(f) != "PortableMath.cs")
            .SelectMany(f => File.ReadLines(f).Select((line, i) => (f, i, line)))
            .Where(x => forbidden.IsMatch(x.line) && !x.line.TrimStart().StartsWith("//") && !x.line.TrimStart().StartsWith("///"))
            .Select(x => $"{Path.GetRelativePath(library, x.f)}:{x.i + 1}: {x.line.Trim()}")
            .ToList();
        Assert.True(offences.Count == 0, "platform maths in the library:\n" + string.Join("\n", offences));
    }
}
