using BenchmarkDotNet.Running;

namespace MpptArena.Benchmarks;

/// <summary>Runs the suites: ./run.sh bench --filter '*ArrayCurve*' (or '*' for all).</summary>
internal static class Program
{
    public static void Main(string[] args) => BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
}
