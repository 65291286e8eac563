using MpptArena.Trackers;

namespace SamplePlugin;

/// <summary>
/// A plug-in with the bugs C# tracker code has, chosen by the 'fault' parameter and injected after
/// t = 0.5 s: 1 throws, 2 calls Environment.Exit(0), 3 Environment.FailFast, 4 throws on a thread of its own,
/// 5 overflows the stack, 6 allocates without bound, 7 writes to and replaces Console.Out, 8 loops for ever.
/// Before the fault (and with fault 0) it holds a reference that a static counter shifts, as code with
/// static state does: fresh statics per instance keep it at 0.75 Voc.
/// </summary>
[TrackerKind("sample_faulty", Summary = "Test plug-in: injects one fault after 0.5 s", Source = "test fixture")]
public sealed class FaultyTracker(TrackerSettings settings) : IMpptTracker
{
    private static int s_instances;
    private static readonly List<byte[]> Hoard = [];
    private double _reference;

    public static IReadOnlyList<TrackerParameter> Parameters { get; } =
        [new("fault", "-", 0, 0, 8, "Which fault to inject after 0.5 s (0: none)")];

    public TrackerCommandKind CommandKind => TrackerCommandKind.VoltageReference;

    public double Reset(TrackerContext context)
    {
        s_instances++;
        return _reference = (0.75 + 0.05 * (s_instances - 1)) * context.NominalOpenCircuitVoltageV;
    }

    public double Step(in TrackerMeasurement measurement)
    {
        if (measurement.TimeS <= 0.5) return _reference;
        switch ((int)settings["fault"])
        {
            case 1: throw new InvalidOperationException("duty register out of sync");
            case 2: Environment.Exit(0); break;
            case 3: Environment.FailFast("firmware assertion"); break;
            case 4:
                var t = new Thread(() => throw new InvalidOperationException("from the tracker's own thread"));
                t.Start();
                t.Join();
                break;
            case 5: return Recurse(0);
            case 6:
                while (true) Hoard.Add(new byte[1 << 20]);
            case 7:
                Console.WriteLine("tracker chatter on stdout");
                Console.SetOut(TextWriter.Null);
                break;
            case 8:
                while (true) Thread.SpinWait(1000);
        }
        return _reference;
    }

    private static double Recurse(int depth) => depth < 0 ? 0 : Recurse(depth + 1) + 1;
}
