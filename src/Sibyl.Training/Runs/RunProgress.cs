namespace Sibyl.Training.Runs;

/// <summary>Where a run stands.</summary>
/// <param name="Done">Points computed so far in this run.</param>
/// <param name="Total">Points this run has to compute (already stored chunks excluded).</param>
/// <param name="Failed">Points among <paramref name="Done"/> whose calculation failed.</param>
/// <param name="Elapsed">Wall time since the run started.</param>
public sealed record RunProgress(int Done, int Total, int Failed, TimeSpan Elapsed)
{
    /// <summary>Points per second so far (0 before the first point).</summary>
    public double Rate => Done > 0 && Elapsed > TimeSpan.Zero ? Done / Elapsed.TotalSeconds : 0.0;

    /// <summary>Estimated time left at the current rate, or null before the first point.</summary>
    public TimeSpan? Remaining => Rate > 0 ? TimeSpan.FromSeconds((Total - Done) / Rate) : null;
}
