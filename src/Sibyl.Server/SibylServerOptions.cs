namespace Sibyl.Server;

/// <summary>Where a <see cref="SibylServer"/> listens and how much one request may ask of it.</summary>
public sealed record SibylServerOptions
{
    /// <summary>Default port of <c>sibyl serve</c>.</summary>
    public const int DefaultPort = 50051;

    /// <summary>
    /// Address to bind: an IP address (default 127.0.0.1, loopback only: the server has no authentication) or
    /// <c>localhost</c>. Binding a public address exposes the server to the network; do it only behind a firewall.
    /// </summary>
    public string Host { get; init; } = "127.0.0.1";

    /// <summary>TCP port, 0 to 65535; 0 picks a free port (see <see cref="SibylServer.Address"/>). Default 50051.</summary>
    public int Port { get; init; } = DefaultPort;

    /// <summary>Most points in one PredictBatch call (default 10,000); more are refused with RESOURCE_EXHAUSTED.</summary>
    public int MaxBatch { get; init; } = 10_000;

    /// <summary>
    /// Largest message received or sent, in bytes (default 64 MiB: a batch of 10,000 matter spectra at 100 k values
    /// with the k values repeated is about 17 MB). Larger messages fail with RESOURCE_EXHAUSTED.
    /// </summary>
    public int MaxMessageBytes { get; init; } = 64 * 1024 * 1024;

    /// <summary>Most requested k values in one point (default 10,000); more are refused with INVALID_ARGUMENT.</summary>
    public int MaxKValues { get; init; } = 10_000;

    /// <summary>How long a stop waits for calls in flight before cutting them off (default 5 s).</summary>
    public TimeSpan ShutdownTimeout { get; init; } = TimeSpan.FromSeconds(5);

    /// <summary>Checks the ranges.</summary>
    /// <exception cref="ArgumentException">A value is out of range; the message names it.</exception>
    public void Validate()
    {
        if (string.IsNullOrWhiteSpace(Host))
        {
            throw new ArgumentException("host: must not be empty", nameof(Host));
        }

        if (Port is < 0 or > 65535)
        {
            throw new ArgumentException($"port: must lie in [0, 65535], got {Port}", nameof(Port));
        }

        if (MaxBatch < 1 || MaxMessageBytes < 1024 || MaxKValues < 1 || ShutdownTimeout < TimeSpan.Zero)
        {
            throw new ArgumentException("max batch and max k values must be at least 1, max message bytes at least 1024, the shutdown timeout not negative");
        }
    }
}
