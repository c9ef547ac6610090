extern alias server;

using Grpc.Core;
using Microsoft.Extensions.Logging.Abstractions;
using server::Sibyl.Server;
using server::Sibyl.Server.Internal;
using Wire = server::Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>The service class called directly, without a server or a network.</summary>
[Collection(ServerCollection.Name)]
public sealed class EmulatorServiceTests(ServerFixture fixture)
{
    [Fact]
    public async Task The_service_answers_a_batch_within_its_limit_and_refuses_one_above_it()
    {
        using var catalog = new EmulatorCatalog([new ServedEmulator("slices", fixture.Slices, 10)], new SibylServerOptions { MaxBatch = 2 });
        var service = new EmulatorService(catalog, NullLogger<EmulatorService>.Instance);
        var batch = new Wire.PredictBatchRequest();
        batch.Points.Add([Point(0.12), Point(0.13)]);
        var reply = await service.PredictBatch(batch, new TestCallContext());
        Assert.Equal(new Reference(fixture.Slices, [0.13, 0.8], 0).Observables[0], reply.Points[1].Observables[0].Values);

        batch.Points.Add(Point(0.11));
        var e = await Assert.ThrowsAsync<RpcException>(() => service.PredictBatch(batch, new TestCallContext()));
        Assert.Equal(StatusCode.ResourceExhausted, e.StatusCode);
    }

    [Fact]
    public async Task The_service_describes_every_emulator_when_no_name_is_given()
    {
        using var catalog = new EmulatorCatalog(
            [new ServedEmulator("a", fixture.Slices, 10), new ServedEmulator("b", fixture.RedshiftInput, 10)], new SibylServerOptions());
        var reply = await new EmulatorService(catalog, NullLogger<EmulatorService>.Instance).Describe(new Wire.DescribeRequest(), new TestCallContext());
        Assert.Equal(["a", "b"], reply.Emulators.Select(e => e.Name));
    }

    private static Wire.PredictRequest Point(double omegaCdm)
    {
        var request = new Wire.PredictRequest { Emulator = "slices", Z = 0.5 };
        request.Parameters.Add("omega_cdm", omegaCdm);
        request.Parameters.Add("sigma8", 0.8);
        return request;
    }
}
