using Grpc.Core;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Server.Internal;

/// <summary>
/// The one place where failures become gRPC statuses (the table is in protos/sibyl/v1/emulator.proto): the server's
/// own refusals carry their code; the emulator's parameter checks are out-of-range failures (finiteness is checked
/// before them); any other argument failure is an invalid argument. Everything else is a server fault and is left
/// to gRPC, which answers UNKNOWN without details.
/// </summary>
internal static class StatusMapping
{
    /// <summary>True for failures caused by the request.</summary>
    public static bool IsRequestError(Exception e) => e is RequestRejectedException or ArgumentException;

    /// <summary>The status for a request error, the message prefixed (for example "point 3: ").</summary>
    public static RpcException ToRpcException(Exception e, string prefix = "")
    {
        var code = e switch
        {
            RequestRejectedException r => r.Code,
            ParameterOutOfRangeException => StatusCode.OutOfRange,
            _ => StatusCode.InvalidArgument,
        };
        return new RpcException(new Status(code, prefix + e.Message));
    }

    public static RequestRejectedException Invalid(string message) => new(StatusCode.InvalidArgument, message);

    public static RequestRejectedException OutOfRange(string message) => new(StatusCode.OutOfRange, message);

    public static RequestRejectedException NotFound(string message) => new(StatusCode.NotFound, message);

    public static RequestRejectedException TooLarge(string message) => new(StatusCode.ResourceExhausted, message);
}
