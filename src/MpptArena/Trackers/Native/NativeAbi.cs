using System.Runtime.InteropServices;

namespace MpptArena.Trackers.Native;

/// <summary>The structs of mppt_arena_tracker.h (ABI version 1), laid out as the C compiler lays them out.</summary>
internal static class NativeAbi
{
    public const uint Version = 1;

    [StructLayout(LayoutKind.Sequential)]
    public struct Context
    {
        public double SamplePeriodS, MinCommand, MaxCommand, NominalOpenCircuitVoltageV, NominalShortCircuitCurrentA, VoltageLsbV, CurrentLsbA;
        public int VoltageBits, CurrentBits;
    }

    [StructLayout(LayoutKind.Sequential)]
    public struct Measurement
    {
        public double TimeS, VoltageV, CurrentA;
        public long VoltageCodeSum, CurrentCodeSum;
        public int Conversions, Reserved;
        public double PreviousCommand;
    }

    [StructLayout(LayoutKind.Sequential)]
    public struct Parameter
    {
        public IntPtr Name;
        public double Value;
    }

    [StructLayout(LayoutKind.Sequential)]
    public struct ParameterInfo
    {
        public IntPtr Name, Unit;
        public double Default, Min, Max;
        public IntPtr Description;
    }
}
