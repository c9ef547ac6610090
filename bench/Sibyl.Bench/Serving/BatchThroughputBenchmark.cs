using BenchmarkDotNet.Attributes;
using Sibyl.Client;
using Sibyl.Server;
using Sibyl.V1;

namespace Sibyl.Bench.Serving;

/// <summary>
/// Batched serving: PredictBatch calls of 1000 points (an ensemble sampler's step), server and client in one process
/// on the machine's 2 cores, time per spectrum (OperationsPerInvoke) so that Spectra/s is the throughput; once with one
/// call at a time and once with two clients on their own connections calling at once. DESIGN.md: ≥ 100,000 spectra/s.
/// </summary>
[Config(typeof(ThroughputConfig))]
public class BatchThroughputBenchmark
{
    private const int BatchSize = 1000;

    private SibylServer _server = null!;
    private SibylClient _first = null!, _second = null!;
    private PredictRequest[] _points = [];

    [GlobalSetup]
    public void Setup()
    {
        _server = SibylServer.StartAsync([new("quick", ServingEmulator.Load())], new SibylServerOptions { Port = 0 }).GetAwaiter().GetResult();
        _first = new SibylClient(_server.Address);
        _second = new SibylClient(_server.Address);
        _points = [.. Enumerable.Range(0, BatchSize).Select(ServingEmulator.Request)];
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _first.Dispose();
        _second.Dispose();
        _server.DisposeAsync().AsTask().GetAwaiter().GetResult();
    }

    [Benchmark(OperationsPerInvoke = BatchSize, Description = "PredictBatch of 1000, one call at a time")]
    public Task<IReadOnlyList<PredictReply>> OneClient() => _first.PredictBatchAsync(_points);

    [Benchmark(OperationsPerInvoke = 2 * BatchSize, Description = "PredictBatch of 1000, two clients at once")]
    public Task<IReadOnlyList<PredictReply>[]> TwoClients() => Task.WhenAll(_first.PredictBatchAsync(_points), _second.PredictBatchAsync(_points));
}
