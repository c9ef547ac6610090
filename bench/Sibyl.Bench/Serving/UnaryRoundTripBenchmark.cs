using BenchmarkDotNet.Attributes;
using Sibyl.Client;
using Sibyl.Server;
using Sibyl.V1;

namespace Sibyl.Bench.Serving;

/// <summary>
/// One Predict call on loopback through the typed client (HTTP/2, one connection), server and client in one process
/// sharing the machine's 2 cores: the round trip a single-chain sampler pays per spectrum. DESIGN.md: ≤ 100 µs median.
/// </summary>
[Config(typeof(LatencyConfig))]
public class UnaryRoundTripBenchmark
{
    private SibylServer _server = null!;
    private SibylClient _client = null!;
    private PredictRequest _request = null!;

    [GlobalSetup]
    public void Setup()
    {
        _server = SibylServer.StartAsync([new("quick", ServingEmulator.Load())], new SibylServerOptions { Port = 0 }).GetAwaiter().GetResult();
        _client = new SibylClient(_server.Address);
        _request = ServingEmulator.Request();
        _client.Predict(_request);
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _client.Dispose();
        _server.DisposeAsync().AsTask().GetAwaiter().GetResult();
    }

    [Benchmark(Description = "unary Predict, blocking call")]
    public PredictReply Blocking() => _client.Predict(_request);

    [Benchmark(Description = "unary Predict, async call")]
    public Task<PredictReply> Async() => _client.PredictAsync(_request);
}
