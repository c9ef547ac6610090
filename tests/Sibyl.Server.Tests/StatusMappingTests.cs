extern alias server;

using Grpc.Core;
using server::Sibyl.Server.Internal;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Server.Tests;

/// <summary>The one table from failures to statuses.</summary>
public sealed class StatusMappingTests
{
    [Fact]
    public void Out_of_box_parameters_map_to_OUT_OF_RANGE_without_the_framework_suffix()
    {
        var e = StatusMapping.ToRpcException(new ParameterOutOfRangeException("h", "0.9 is outside [0.6, 0.8]"), "point 2: ");
        Assert.Equal(StatusCode.OutOfRange, e.StatusCode);
        Assert.Equal("point 2: h: 0.9 is outside [0.6, 0.8]", e.Status.Detail);
    }

    [Fact]
    public void Server_refusals_keep_their_code_and_other_argument_errors_are_INVALID_ARGUMENT()
    {
        Assert.Equal(StatusCode.ResourceExhausted, StatusMapping.ToRpcException(StatusMapping.TooLarge("x")).StatusCode);
        Assert.Equal(StatusCode.NotFound, StatusMapping.ToRpcException(StatusMapping.NotFound("x")).StatusCode);
        Assert.Equal(StatusCode.InvalidArgument, StatusMapping.ToRpcException(new ArgumentException("x")).StatusCode);
        Assert.False(StatusMapping.IsRequestError(new InvalidOperationException()));
    }
}
