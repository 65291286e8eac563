using BenchmarkDotNet.Attributes;
using MpptArena.Arrays;
using MpptArena.Benchmarks.Reference;

namespace MpptArena.Benchmarks;

/// <summary>
/// Array current at a voltage for the 2 x 10 x 3 array with every substring different: the
/// straightforward nested bisection (reference), the library's exact nested solve, and the prepared
/// curve; plus the cost of preparing the curve after a change of conditions, and of a new curve under a
/// uniform sky (what every step of a ramp costs when it reaches conditions not seen before). 16 voltages
/// per operation.
/// </summary>
[MemoryDiagnoser]
public class ArrayCurveBenchmarks
{
    private ReferenceArray _reference = null!;
    private ExactArrayCurve _exact = null!;
    private PreparedArrayCurve _prepared = null!;
    private PvArray _array = null!;
    private ArrayConditions _conditions = null!, _uniform = null!;
    private readonly double[] _voltages = new double[16];

    [GlobalSetup]
    public void Setup()
    {
        _array = BenchmarkArrays.TwoByTen();
        _conditions = BenchmarkArrays.AllDifferent(_array);
        _uniform = _array.UniformConditions(450, 34);
        _reference = new ReferenceArray(_array, _conditions);
        _exact = _array.Solve(_conditions);
        _prepared = new PreparedArrayCurve(_exact);
        for (int k = 0; k < _voltages.Length; k++) _voltages[k] = _exact.OpenCircuitVoltageV * (k + 0.5) / _voltages.Length;
    }

    [Benchmark(Baseline = true, Description = "reference nested bisection, 16 V")]
    public double ReferenceNestedBisection()
    {
        double s = 0;
        foreach (double v in _voltages) s += _reference.CurrentAtVoltage(v);
        return s;
    }

    [Benchmark(Description = "exact nested solve (Lambert W + Newton), 16 V")]
    public double ExactNestedSolve()
    {
        double s = 0;
        foreach (double v in _voltages) s += _exact.CurrentAtVoltage(v);
        return s;
    }

    [Benchmark(Description = "prepared curve, 16 V")]
    public double PreparedCurve()
    {
        double s = 0;
        foreach (double v in _voltages) s += _prepared.CurrentAtVoltage(v);
        return s;
    }

    [Benchmark(Description = "prepare after a change (solve + tabulate)")]
    public PreparedArrayCurve Prepare() => new(_array.Solve(_conditions));

    [Benchmark(Description = "prepare + find every MPP")]
    public PowerPeaks PrepareAndSearch() => MppSearch.FindPeaks(new PreparedArrayCurve(_array.Solve(_conditions)));

    [Benchmark(Description = "uniform sky (a ramp's new curve): prepare + MPP by the coarse scan")]
    public PowerPeaks PrepareUniformAndSearch() => MppSearch.FindPeaks(new PreparedArrayCurve(_array.Solve(_uniform)), 64);
}
