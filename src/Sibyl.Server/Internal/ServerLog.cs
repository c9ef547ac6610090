using Grpc.Core;
using Microsoft.Extensions.Logging;

namespace Sibyl.Server.Internal;

/// <summary>Source-generated log messages of the server.</summary>
internal static partial class ServerLog
{
    [LoggerMessage(EventId = 1, Level = LogLevel.Information, Message = "Serving emulator {Summary}")]
    public static partial void Serving(ILogger logger, string summary);

    [LoggerMessage(EventId = 2, Level = LogLevel.Debug, Message = "{Method} refused with {Code}: {Reason}")]
    public static partial void Refused(ILogger logger, string method, StatusCode code, string reason);

    [LoggerMessage(EventId = 3, Level = LogLevel.Debug, Message = "Stream ended after {Count} points: the client went away")]
    public static partial void ClientGone(ILogger logger, int count);
}
