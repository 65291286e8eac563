namespace MpptArena.Cli;

internal static class Program
{
    public static int Main(string[] args) => 0;
}
