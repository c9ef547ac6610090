using System.Collections.Concurrent;
using System.Diagnostics;
using System.Runtime.ExceptionServices;
using Sibyl.Training.Design;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Runs;

/// <summary>
/// Computes a shard's chunks of a design on several threads and stores each finished chunk atomically in the run
/// folder. A chunk already there, from the same design and build, is kept, so a killed run resumes by computing
/// only what is missing and loses at most the chunks that were in flight. A point whose calculation fails is
/// stored with its error and reported, never dropped.
/// </summary>
public sealed class TrainingRun
{
    private readonly TrainingDesign _design;
    private readonly string _folder;
    private readonly ShardSelection _shard;
    private readonly int _threads;
    private readonly bool _retryFailed;
    private readonly PointCalculator _calculator;

    /// <summary>Prepares a run; nothing is computed or written yet.</summary>
    /// <param name="design">The design.</param>
    /// <param name="folder">Run folder (created if missing), shared by all shards.</param>
    /// <param name="shard">Which chunks to compute.</param>
    /// <param name="threads">Worker threads, at least 1.</param>
    /// <param name="retryFailed">Recompute stored chunks that hold failed points (for example after a provider timeout).</param>
    public TrainingRun(TrainingDesign design, string folder, ShardSelection shard, int threads, bool retryFailed)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(shard);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(threads);
        _design = design;
        _folder = folder;
        _shard = shard;
        _threads = threads;
        _retryFailed = retryFailed;
        _calculator = new PointCalculator(design);
    }

    /// <summary>Runs to completion or cancellation; stored chunks stay valid either way.</summary>
    /// <param name="progress">Receives progress after each point (from worker threads).</param>
    /// <param name="notice">Receives one line per noteworthy event (a damaged chunk being recomputed).</param>
    /// <param name="cancellation">Stops taking new chunks and abandons the ones in flight.</param>
    /// <exception cref="RunConflictException">The folder holds chunks of this design computed by another build.</exception>
    /// <exception cref="OperationCanceledException">Cancelled; completed chunks are stored.</exception>
    /// <exception cref="IOException">A chunk could not be written (the first such failure).</exception>
    public RunSummary Execute(IProgress<RunProgress>? progress, Action<string>? notice, CancellationToken cancellation)
    {
        var clock = Stopwatch.StartNew();
        Directory.CreateDirectory(_folder);
        var owned = Enumerable.Range(0, _design.ChunkCount).Where(_shard.Owns).ToList();
        var failures = new ConcurrentBag<PointFailure>();
        var todo = new List<int>();
        foreach (int chunk in owned)
        {
            if (Stored(chunk, notice) is { } stored && !(_retryFailed && stored.Errors.Any(e => e is not null)))
            {
                Collect(stored, failures);
            }
            else
            {
                todo.Add(chunk);
            }
        }

        int total = todo.Sum(c => _design.ChunkRange(c).End - _design.ChunkRange(c).Start);
        int done = 0, failed = 0;
        progress?.Report(new RunProgress(0, total, 0, clock.Elapsed));
        var options = new ParallelOptions { MaxDegreeOfParallelism = _threads, CancellationToken = cancellation };
        var partition = System.Collections.Concurrent.Partitioner.Create(todo, EnumerablePartitionerOptions.NoBuffering);
        try
        {
            Parallel.ForEach(partition, options, chunk =>
            {
                var result = Compute(chunk, cancellation, failedNow =>
                {
                    int d = Interlocked.Increment(ref done);
                    int f = failedNow ? Interlocked.Increment(ref failed) : Volatile.Read(ref failed);
                    progress?.Report(new RunProgress(d, total, f, clock.Elapsed));
                });
                ChunkFile.Write(_folder, result);
                Collect(result, failures);
            });
        }
        catch (AggregateException e) when (e.InnerExceptions.Count > 0 && e.InnerExceptions.All(x => x is IOException or UnauthorizedAccessException))
        {
            // A full disk or a vanished folder stops every worker the same way; the first cause is the one to report.
            ExceptionDispatchInfo.Capture(e.InnerExceptions[0]).Throw();
        }

        return new RunSummary(owned.Count, owned.Count - todo.Count, total, failures.OrderBy(f => f.Index).ToList(), clock.Elapsed);
    }

    private ChunkContract? Stored(int chunk, Action<string>? notice)
    {
        string path = ChunkFile.PathOf(_folder, chunk);
        if (!File.Exists(path))
        {
            return null;
        }

        ChunkContract stored;
        try
        {
            stored = ChunkFile.Read(path, _design, _calculator.ValuesPerPoint);
        }
        catch (CorruptFileException e)
        {
            notice?.Invoke($"{e.Message}; computing it again");
            return null;
        }

        if (stored.CodeFingerprint != CodeFingerprint.Current)
        {
            throw new RunConflictException(
                $"{path} was computed by another build of Sibyl (code fingerprint {stored.CodeFingerprint}, this build {CodeFingerprint.Current}); " +
                "finish the run with that build, or start over in a new --out folder, so that one training set holds one version of the physics");
        }

        return stored;
    }

    private ChunkContract Compute(int chunk, CancellationToken cancellation, Action<bool> pointDone)
    {
        var (start, end) = _design.ChunkRange(chunk);
        var values = new double[]?[end - start];
        var errors = new string?[end - start];
        for (int i = start; i < end; i++)
        {
            cancellation.ThrowIfCancellationRequested();
            try
            {
                values[i - start] = _calculator.Compute(i, cancellation);
            }
            catch (Exception e) when (e is not OperationCanceledException || !cancellation.IsCancellationRequested)
            {
                errors[i - start] = PointCalculator.IsPointFailure(e)
                    ? e.Message.Split(" (Parameter '")[0]
                    : $"{e.GetType().Name}: {e.Message}";
            }

            pointDone(errors[i - start] is not null);
        }

        return new ChunkContract
        {
            DesignHash = _design.Hash,
            CodeFingerprint = CodeFingerprint.Current,
            Chunk = chunk,
            Shard = _shard.Index,
            ShardCount = _shard.Count,
            Values = values,
            Errors = errors,
        };
    }

    private void Collect(ChunkContract chunk, ConcurrentBag<PointFailure> failures)
    {
        int start = _design.ChunkRange(chunk.Chunk).Start;
        for (int i = 0; i < chunk.Errors.Length; i++)
        {
            if (chunk.Errors[i] is { } error)
            {
                failures.Add(new PointFailure(start + i, _design.Point(start + i), error));
            }
        }
    }
}
