namespace MpptArena.Benchmarks;

internal static class Program
{
    public static void Main(string[] args) { }
}
