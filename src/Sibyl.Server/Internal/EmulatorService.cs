using Grpc.Core;
using Microsoft.Extensions.Logging;
using Sibyl.V1;

namespace Sibyl.Server.Internal;

/// <summary>
/// The gRPC service: translates messages and calls the emulators; no physics here. Request errors leave through
/// <see cref="StatusMapping"/>; batches run on all cores in chunks, each thread with its own predictor.
/// </summary>
internal sealed class EmulatorService(EmulatorCatalog catalog, ILogger<EmulatorService> logger) : V1.Emulator.EmulatorBase
{
    /// <summary>Points per parallel chunk: large enough that scheduling costs little next to a few-µs prediction.</summary>
    private const int ChunkSize = 64;

    public override Task<DescribeReply> Describe(DescribeRequest request, ServerCallContext context)
    {
        var reply = new DescribeReply();
        if (request.Emulator.Length == 0)
        {
            reply.Emulators.AddRange(catalog.All.Select(e => e.Description));
            return Task.FromResult(reply);
        }

        try
        {
            reply.Emulators.Add(catalog.Find(request.Emulator).Description);
        }
        catch (Exception e) when (StatusMapping.IsRequestError(e))
        {
            throw Refuse(nameof(Describe), e, "");
        }

        return Task.FromResult(reply);
    }

    public override Task<PredictReply> Predict(PredictRequest request, ServerCallContext context)
    {
        try
        {
            return Task.FromResult(catalog.Find(request.Emulator).Predict(request));
        }
        catch (Exception e) when (StatusMapping.IsRequestError(e))
        {
            throw Refuse(nameof(Predict), e, "");
        }
    }

    public override Task<PredictBatchReply> PredictBatch(PredictBatchRequest request, ServerCallContext context)
    {
        var points = request.Points;
        int max = catalog.Options.MaxBatch;
        if (points.Count > max)
        {
            throw Refuse(nameof(PredictBatch), StatusMapping.TooLarge($"points: {points.Count} in one batch, at most {max} (split the batch, or start the server with a larger --max-batch)"), "");
        }

        var replies = new PredictReply[points.Count];
        (int Index, Exception Error)? failure;
        if (points.Count <= ChunkSize)
        {
            failure = PredictRange(points, replies, 0, points.Count, state: null);
        }
        else
        {
            // One slot per chunk, written only by the thread running that chunk, so no concurrent collection is needed.
            // Break (not Stop) lets every chunk below a failing one finish, so the lowest break is the lowest bad point.
            var failures = new (int Index, Exception Error)?[(points.Count + ChunkSize - 1) / ChunkSize];
            var result = Parallel.For(
                0,
                failures.Length,
                new ParallelOptions { CancellationToken = context.CancellationToken },
                (chunk, state) =>
                {
                    failures[chunk] = PredictRange(points, replies, chunk * ChunkSize, Math.Min(points.Count, (chunk + 1) * ChunkSize), state);
                    if (failures[chunk] is not null)
                    {
                        state.Break();
                    }
                });
            failure = result.LowestBreakIteration is long lowest ? failures[lowest] : null;
        }

        if (failure is (int index, Exception error))
        {
            throw Refuse(nameof(PredictBatch), error, $"point {index}: ");
        }

        var reply = new PredictBatchReply();
        reply.Points.AddRange(replies);
        return Task.FromResult(reply);
    }

    public override async Task PredictStream(IAsyncStreamReader<PredictRequest> requestStream, IServerStreamWriter<PredictReply> responseStream, ServerCallContext context)
    {
        int count = 0;
        try
        {
            while (await requestStream.MoveNext(context.CancellationToken))
            {
                var request = requestStream.Current;
                PredictReply reply;
                try
                {
                    reply = catalog.Find(request.Emulator).Predict(request);
                }
                catch (Exception e) when (StatusMapping.IsRequestError(e))
                {
                    throw Refuse(nameof(PredictStream), e, $"point {count}: ");
                }

                await responseStream.WriteAsync(reply, context.CancellationToken);
                count++;
            }
        }
        catch (Exception e) when (e is OperationCanceledException or IOException && context.CancellationToken.IsCancellationRequested)
        {
            // The client cancelled or disconnected mid-stream: nothing to answer, and nothing is wrong with the server.
            ServerLog.ClientGone(logger, count);
        }
    }

    /// <summary>Predicts points [start, end) into <paramref name="replies"/>; returns the first bad point, if any.</summary>
    private (int Index, Exception Error)? PredictRange(IList<PredictRequest> points, PredictReply[] replies, int start, int end, ParallelLoopState? state)
    {
        for (int i = start; i < end; i++)
        {
            // A chunk above a failed one is wasted work: the reply will be the error, and only a lower point can change it.
            if (state is { ShouldExitCurrentIteration: true })
            {
                return null;
            }

            try
            {
                replies[i] = catalog.Find(points[i].Emulator).Predict(points[i]);
            }
            catch (Exception e) when (StatusMapping.IsRequestError(e))
            {
                // Only the first bad point of a chunk matters: the reply names the lowest one of all chunks.
                return (i, e);
            }
        }

        return null;
    }

    private RpcException Refuse(string method, Exception error, string prefix)
    {
        var rpc = StatusMapping.ToRpcException(error, prefix);
        ServerLog.Refused(logger, method, rpc.StatusCode, rpc.Status.Detail);
        return rpc;
    }
}
