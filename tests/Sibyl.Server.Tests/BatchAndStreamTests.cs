using Grpc.Core;
using Sibyl.Client;
using Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>Many points per call, streams, and many clients at once.</summary>
[Collection(ServerCollection.Name)]
public sealed class BatchAndStreamTests(ServerFixture fixture)
{
    [Fact]
    public async Task A_batch_of_5000_points_equals_the_in_process_emulator_point_by_point()
    {
        // Exact equality, as for unary calls: the batch runs the same code on several threads, each with its own predictor.
        var points = Points(5000).ToList();
        var replies = await fixture.Client.PredictBatchAsync(points.Select(p => p.Request));
        Assert.Equal(5000, replies.Count);
        for (int i = 0; i < points.Count; i++)
        {
            var expected = new Reference(fixture.Slices, points[i].Parameters, points[i].Slice, new Dictionary<string, double> { ["cs2"] = points[i].Cs2 });
            Assert.Equal(expected.Observables[0], replies[i].Observables[0].Values);
        }
    }

    [Fact]
    public async Task A_stream_answers_every_point_in_order_as_unary_calls_do()
    {
        var requests = Points(40).Select(p => p.Request).ToList();
        var replies = new List<PredictReply>();
        await foreach (var reply in fixture.Client.PredictStreamAsync(requests.ToAsyncEnumerable()))
        {
            replies.Add(reply);
        }

        Assert.Equal(requests.Count, replies.Count);
        for (int i = 0; i < requests.Count; i++)
        {
            Assert.Equal(await fixture.Client.PredictAsync(requests[i]), replies[i]);
        }
    }

    [Fact]
    public async Task A_bad_point_ends_the_stream_with_its_status_and_index()
    {
        var requests = Points(5).Select(p => p.Request).Append(Reference.Slices(0.2, 0.8, 0.5)).ToAsyncEnumerable();
        int received = 0;
        var e = await Assert.ThrowsAsync<RpcException>(async () =>
        {
            await foreach (var reply in fixture.Client.PredictStreamAsync(requests))
            {
                received++;
            }
        });
        Assert.Equal(StatusCode.OutOfRange, e.StatusCode);
        Assert.StartsWith("point 5: omega_cdm", e.Status.Detail, StringComparison.Ordinal);
        Assert.Equal(5, received);
    }

    [Fact]
    public async Task A_client_that_disconnects_mid_stream_leaves_the_server_working()
    {
        var request = Reference.Slices(0.12, 0.8, 0.5);
        using (var cancellation = new CancellationTokenSource())
        using (var doomed = new SibylClient(fixture.Address))
        {
            var call = doomed.Raw.PredictStream(cancellationToken: cancellation.Token);
            await call.RequestStream.WriteAsync(request);
            Assert.True(await call.ResponseStream.MoveNext());
            await call.RequestStream.WriteAsync(request);
            await cancellation.CancelAsync();
        }

        using (var dropped = new SibylClient(fixture.Address))
        {
            // No cancellation: the connection itself goes away with the channel, requests still unanswered.
            var call = dropped.Raw.PredictStream();
            await call.RequestStream.WriteAsync(request);
            await call.RequestStream.WriteAsync(request);
        }

        var expected = new Reference(fixture.Slices, [0.12, 0.8], 0).Observables[0];
        Assert.Equal(expected, (await fixture.Client.PredictAsync(request)).Observables[0].Values);
        await foreach (var reply in fixture.Client.PredictStreamAsync(new[] { request }.ToAsyncEnumerable()))
        {
            Assert.Equal(expected, reply.Observables[0].Values);
        }
    }

    [Fact]
    public async Task Eight_concurrent_clients_get_the_answers_of_sequential_calls()
    {
        // 8 tasks × 50 calls on separate connections: each server thread has its own predictor and buffers, so the
        // answers must not depend on interleaving; exact equality.
        var requests = Points(50).Select(p => p.Request).ToList();
        var sequential = new List<PredictReply>();
        foreach (var r in requests)
        {
            sequential.Add(await fixture.Client.PredictAsync(r));
        }

        var clients = Enumerable.Range(0, 8).Select(_ => new SibylClient(fixture.Address)).ToList();
        try
        {
            var results = await Task.WhenAll(clients.Select((client, c) => Task.Run(async () =>
            {
                var replies = new PredictReply[requests.Count];
                for (int n = 0; n < requests.Count; n++)
                {
                    int i = (n + (7 * c)) % requests.Count;
                    replies[i] = await client.PredictAsync(requests[i]);
                }

                return replies;
            })));
            Assert.All(results, replies => Assert.Equal(sequential, replies));
        }
        finally
        {
            clients.ForEach(c => c.Dispose());
        }
    }

    /// <summary>Points spread over the box, both slices and a range of cs2, reproducibly.</summary>
    private static IEnumerable<(PredictRequest Request, double[] Parameters, int Slice, double Cs2)> Points(int count)
    {
        for (int i = 0; i < count; i++)
        {
            double u = ((i * 0.618034) + 0.1) % 1.0, v = ((i * 0.4142136) + 0.3) % 1.0;
            double[] parameters = [0.10 + (0.04 * u), 0.72 + (0.18 * v)];
            int slice = i % 2;
            double cs2 = (i % 7) - 3.0;
            yield return (Reference.Slices(parameters[0], parameters[1], slice == 0 ? 0.5 : 1.0, cs2), parameters, slice, cs2);
        }
    }
}
