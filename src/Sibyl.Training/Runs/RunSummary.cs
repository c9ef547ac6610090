namespace Sibyl.Training.Runs;

/// <summary>What a run did.</summary>
/// <param name="ChunksOwned">Chunks of this shard.</param>
/// <param name="ChunksReused">Of those, chunks already on disk from an earlier run and kept.</param>
/// <param name="PointsComputed">Points computed now.</param>
/// <param name="Failures">Every failed point of this shard, stored earlier or now.</param>
/// <param name="Elapsed">Wall time.</param>
public sealed record RunSummary(int ChunksOwned, int ChunksReused, int PointsComputed, IReadOnlyList<PointFailure> Failures, TimeSpan Elapsed);
