extern alias server;

using Grpc.Health.V1;
using Grpc.Net.Client;
using Grpc.Reflection.V1Alpha;
using server::Sibyl.Server;

namespace Sibyl.Server.Tests;

/// <summary>The standard gRPC services that tools and orchestrators use.</summary>
[Collection(ServerCollection.Name)]
public sealed class HealthAndReflectionTests(ServerFixture fixture)
{
    [Theory]
    [InlineData("")]
    [InlineData(SibylServer.ServiceName)]
    public async Task Health_check_answers_SERVING(string service)
    {
        using var channel = GrpcChannel.ForAddress(fixture.Address);
        var reply = await new Health.HealthClient(channel).CheckAsync(new HealthCheckRequest { Service = service });
        Assert.Equal(HealthCheckResponse.Types.ServingStatus.Serving, reply.Status);
    }

    [Fact]
    public async Task Reflection_lists_the_emulator_service_and_serves_its_descriptor()
    {
        using var channel = GrpcChannel.ForAddress(fixture.Address);
        using var call = new ServerReflection.ServerReflectionClient(channel).ServerReflectionInfo();
        await call.RequestStream.WriteAsync(new ServerReflectionRequest { ListServices = "" });
        await call.RequestStream.WriteAsync(new ServerReflectionRequest { FileContainingSymbol = SibylServer.ServiceName });
        await call.RequestStream.CompleteAsync();
        Assert.True(await call.ResponseStream.MoveNext(CancellationToken.None));
        Assert.Contains(SibylServer.ServiceName, call.ResponseStream.Current.ListServicesResponse.Service.Select(s => s.Name));
        Assert.True(await call.ResponseStream.MoveNext(CancellationToken.None));
        var file = Google.Protobuf.Reflection.FileDescriptorProto.Parser.ParseFrom(call.ResponseStream.Current.FileDescriptorResponse.FileDescriptorProto[0]);
        Assert.Equal("sibyl.v1", file.Package);
        Assert.Contains("Emulator", file.Service.Select(s => s.Name));
    }
}
