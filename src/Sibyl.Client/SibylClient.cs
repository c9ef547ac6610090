using System.Runtime.CompilerServices;
using Grpc.Core;
using Grpc.Net.Client;
using Sibyl.V1;

namespace Sibyl.Client;

/// <summary>
/// A typed client of a Sibyl server (protos/sibyl/v1/emulator.proto), over the generated
/// <see cref="Emulator.EmulatorClient"/>. Thread-safe: share one per process (it holds one HTTP/2 connection pool).
/// Every call throws <see cref="RpcException"/> when the server refuses: INVALID_ARGUMENT, OUT_OF_RANGE, NOT_FOUND or
/// RESOURCE_EXHAUSTED with a message naming the parameter and its allowed range (the table is in the proto file).
/// </summary>
public sealed class SibylClient : IDisposable
{
    /// <summary>Largest message sent or received by default, bytes (the server's default limit too).</summary>
    public const int DefaultMaxMessageBytes = 64 * 1024 * 1024;

    private readonly GrpcChannel? _owned;

    /// <summary>Connects to a server, for example <c>http://127.0.0.1:50051</c> (plain HTTP/2, as <c>sibyl serve</c> listens).</summary>
    /// <param name="address">Server address.</param>
    /// <param name="maxMessageBytes">Largest message sent or received, bytes (default 64 MiB), for large batches.</param>
    public SibylClient(Uri address, int maxMessageBytes = DefaultMaxMessageBytes)
    {
        ArgumentNullException.ThrowIfNull(address);
        _owned = GrpcChannel.ForAddress(address, new GrpcChannelOptions
        {
            MaxReceiveMessageSize = maxMessageBytes,
            MaxSendMessageSize = maxMessageBytes,
            HttpHandler = new SocketsHttpHandler { EnableMultipleHttp2Connections = true },
        });
        Raw = new Emulator.EmulatorClient(_owned);
    }

    /// <summary>Uses a call invoker the caller owns (a channel with its own settings, or one with interceptors).</summary>
    public SibylClient(CallInvoker invoker)
    {
        ArgumentNullException.ThrowIfNull(invoker);
        Raw = new Emulator.EmulatorClient(invoker);
    }

    /// <summary>The generated client, for call options this wrapper does not expose (deadlines, headers).</summary>
    public Emulator.EmulatorClient Raw { get; }

    /// <summary>A request for one point: emulator name, parameters by name, z for emulators with fixed slices, nuisance values (missing ones count as 0).</summary>
    public static PredictRequest Point(string emulator, IEnumerable<KeyValuePair<string, double>> parameters, double? z = null, IEnumerable<KeyValuePair<string, double>>? nuisance = null)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        ArgumentNullException.ThrowIfNull(parameters);
        var request = new PredictRequest { Emulator = emulator };
        request.Parameters.Add(parameters.ToDictionary());
        if (z is { } redshift)
        {
            request.Z = redshift;
        }

        if (nuisance is not null)
        {
            request.Nuisance.Add(nuisance.ToDictionary());
        }

        return request;
    }

    /// <summary>Every loaded emulator: parameters and ranges, slices, observables, basis terms, k grid, accuracy.</summary>
    public async Task<IReadOnlyList<EmulatorDescription>> DescribeAsync(CancellationToken cancellation = default) =>
        (await Raw.DescribeAsync(new DescribeRequest(), cancellationToken: cancellation).ConfigureAwait(false)).Emulators;

    /// <summary>One emulator's description.</summary>
    /// <exception cref="RpcException">NOT_FOUND when no emulator has that name.</exception>
    public async Task<EmulatorDescription> DescribeAsync(string emulator, CancellationToken cancellation = default) =>
        (await Raw.DescribeAsync(new DescribeRequest { Emulator = emulator }, cancellationToken: cancellation).ConfigureAwait(false)).Emulators[0];

    /// <summary>One point.</summary>
    public async Task<PredictReply> PredictAsync(PredictRequest request, CancellationToken cancellation = default) =>
        await Raw.PredictAsync(request, cancellationToken: cancellation).ConfigureAwait(false);

    /// <summary>One point, blocking (the lowest latency for a single-threaded sampler).</summary>
    public PredictReply Predict(PredictRequest request, CancellationToken cancellation = default) => Raw.Predict(request, cancellationToken: cancellation);

    /// <summary>Many points in one call, replies in request order; the server spreads them over its cores.</summary>
    /// <exception cref="RpcException">A bad point (the message starts with "point N:"), or more points than the server's batch limit.</exception>
    public async Task<IReadOnlyList<PredictReply>> PredictBatchAsync(IEnumerable<PredictRequest> points, CancellationToken cancellation = default)
    {
        var request = new PredictBatchRequest();
        request.Points.AddRange(points);
        return (await Raw.PredictBatchAsync(request, cancellationToken: cancellation).ConfigureAwait(false)).Points;
    }

    /// <summary>
    /// Streams points to the server while replies stream back, one per point in order. Requests are sent as the
    /// sequence yields them, so a sampler can feed points as it makes them.
    /// </summary>
    /// <exception cref="RpcException">A bad point ends the stream (the message starts with "point N:").</exception>
    public async IAsyncEnumerable<PredictReply> PredictStreamAsync(IAsyncEnumerable<PredictRequest> points, [EnumeratorCancellation] CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(points);
        using var call = Raw.PredictStream(cancellationToken: cancellation);
        var sending = Send(call.RequestStream, points, cancellation);
        await foreach (var reply in call.ResponseStream.ReadAllAsync(cancellation).ConfigureAwait(false))
        {
            yield return reply;
        }

        await sending.ConfigureAwait(false);
    }

    /// <summary>Closes the connection this client opened (not a caller's invoker).</summary>
    public void Dispose() => _owned?.Dispose();

    private static async Task Send(IClientStreamWriter<PredictRequest> writer, IAsyncEnumerable<PredictRequest> points, CancellationToken cancellation)
    {
        await foreach (var point in points.WithCancellation(cancellation).ConfigureAwait(false))
        {
            await writer.WriteAsync(point, cancellation).ConfigureAwait(false);
        }

        await writer.CompleteAsync().ConfigureAwait(false);
    }
}
