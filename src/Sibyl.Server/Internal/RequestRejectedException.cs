using Grpc.Core;

namespace Sibyl.Server.Internal;

/// <summary>A request the server refuses, with the status it deserves; <see cref="StatusMapping"/> turns it into the reply.</summary>
internal sealed class RequestRejectedException(StatusCode code, string message) : Exception(message)
{
    /// <summary>The gRPC status to answer with.</summary>
    public StatusCode Code { get; } = code;
}
