using System.Runtime.InteropServices;

namespace MpptArena.Trackers.Native;

/// <summary>
/// A tracker instance living in a native library. Parameter names are marshalled once at creation; each
/// step passes two stack structs by pointer and allocates nothing.
/// </summary>
public sealed unsafe class NativeTracker : IMpptTracker, IDisposable
{
    private readonly NativeTrackerLibrary _library;
    private readonly KeyValuePair<string, double>[] _values;
    private IntPtr _state;
    private IntPtr[] _names = [];

    internal NativeTracker(NativeTrackerLibrary library, TrackerSettings settings)
    {
        _library = library;
        _values = settings.All.ToArray();
    }

    /// <inheritdoc/>
    public TrackerCommandKind CommandKind => _library.CommandKind;

    /// <inheritdoc/>
    public double Reset(TrackerContext context)
    {
        Release();
        _names = _values.Select(kv => Marshal.StringToCoTaskMemUTF8(kv.Key)).ToArray();
        var parameters = new NativeAbi.Parameter[_values.Length];
        for (int k = 0; k < parameters.Length; k++) parameters[k] = new NativeAbi.Parameter { Name = _names[k], Value = _values[k].Value };
        var ctx = new NativeAbi.Context
        {
            SamplePeriodS = context.SamplePeriodS,
            MinCommand = context.MinCommand,
            MaxCommand = context.MaxCommand,
            NominalOpenCircuitVoltageV = context.NominalOpenCircuitVoltageV,
            NominalShortCircuitCurrentA = context.NominalShortCircuitCurrentA,
            VoltageLsbV = context.VoltageLsbV,
            CurrentLsbA = context.CurrentLsbA,
            VoltageBits = context.VoltageBits,
            CurrentBits = context.CurrentBits,
        };
        double initial = double.NaN;
        fixed (NativeAbi.Parameter* p = parameters)
        {
            _state = _library.Create((IntPtr)p, parameters.Length, &ctx, &initial);
        }
        if (_state == IntPtr.Zero) throw new InvalidOperationException($"mppt_arena_create in '{Path.GetFileName(_library.Path)}' returned NULL");
        return initial;
    }

    /// <inheritdoc/>
    public double Step(in TrackerMeasurement m)
    {
        var (voltageSum, currentSum, n) = Isolation.HostMessages.CodeSums(m);
        var native = new NativeAbi.Measurement
        {
            TimeS = m.TimeS,
            VoltageV = m.VoltageV,
            CurrentA = m.CurrentA,
            VoltageCodeSum = voltageSum,
            CurrentCodeSum = currentSum,
            Conversions = n,
            PreviousCommand = m.PreviousCommand,
        };
        return _library.Step(_state, &native);
    }

    private void Release()
    {
        if (_state != IntPtr.Zero)
        {
            _library.Destroy(_state);
            _state = IntPtr.Zero;
        }
        foreach (var p in _names) Marshal.FreeCoTaskMem(p);
        _names = [];
    }

    /// <summary>Destroys the native instance.</summary>
    public void Dispose() => Release();
}
