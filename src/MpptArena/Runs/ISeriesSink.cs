namespace MpptArena.Runs;

/// <summary>Where a tracker's time series streams as the run goes (a CSV file, a test's list).</summary>
public interface ISeriesSink : IDisposable
{
    /// <summary>Takes one row.</summary>
    void Write(in SeriesRow row);
}
