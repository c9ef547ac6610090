using System.Net;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Server.Kestrel.Core;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Sibyl.Emulation.Emulators;
using Sibyl.Server.Internal;

namespace Sibyl.Server;

/// <summary>
/// A running gRPC server (HTTP/2 without TLS, Kestrel) for a set of named emulators: the <c>sibyl.v1.Emulator</c>
/// service of protos/sibyl/v1/emulator.proto, standard gRPC health checking (<c>grpc.health.v1.Health</c>, SERVING
/// for "" and "sibyl.v1.Emulator") and server reflection. Stops on <see cref="StopAsync"/>, on disposal, or when the
/// process gets SIGINT or SIGTERM (calls in flight get <see cref="SibylServerOptions.ShutdownTimeout"/> to finish).
/// </summary>
public sealed partial class SibylServer : IAsyncDisposable
{
    /// <summary>The gRPC service name, as health checks and reflection know it.</summary>
    public const string ServiceName = "sibyl.v1.Emulator";

    private readonly WebApplication _app;
    private readonly EmulatorCatalog _catalog;

    private SibylServer(WebApplication app, EmulatorCatalog catalog, Uri address)
    {
        _app = app;
        _catalog = catalog;
        Address = address;
    }

    /// <summary>Where the server listens, for example http://127.0.0.1:50051 (the real port when 0 was asked for).</summary>
    public Uri Address { get; }

    /// <summary>One line per emulator: name, parameters, slices, k range and the measured accuracy per basis term.</summary>
    public IReadOnlyList<string> Summaries => [.. _catalog.All.Select(e => e.Summary())];

    /// <summary>Loads nothing itself: serves the given emulators under their names and returns once it listens.</summary>
    /// <param name="emulators">Name → emulator; names are 1–64 letters, digits, '.', '_' or '-', unique.</param>
    /// <param name="options">Address and limits.</param>
    /// <param name="logging">Adds log providers (none by default: the server is silent).</param>
    /// <param name="cancellation">Cancels the start.</param>
    /// <exception cref="ArgumentException">No emulators, a bad or repeated name, or options out of range.</exception>
    /// <exception cref="IOException">The address is in use or cannot be bound.</exception>
    public static async Task<SibylServer> StartAsync(
        IReadOnlyList<KeyValuePair<string, SpectrumEmulator>> emulators,
        SibylServerOptions options,
        Action<ILoggingBuilder>? logging = null,
        CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(emulators);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (emulators.Count == 0)
        {
            throw new ArgumentException("give at least one emulator to serve", nameof(emulators));
        }

        foreach (var (name, _) in emulators)
        {
            if (!NamePattern().IsMatch(name))
            {
                throw new ArgumentException($"emulator name '{name}': use 1-64 letters, digits, '.', '_' or '-'", nameof(emulators));
            }
        }

        if (emulators.Select(e => e.Key).Distinct(StringComparer.Ordinal).Count() != emulators.Count)
        {
            throw new ArgumentException("emulator names must be unique", nameof(emulators));
        }

        var address = options.Host == "localhost" ? IPAddress.Loopback
            : IPAddress.TryParse(options.Host, out var parsed) ? parsed
            : throw new ArgumentException($"host: '{options.Host}' is not an IP address or localhost", nameof(options));
        var catalog = new EmulatorCatalog([.. emulators.Select(e => new ServedEmulator(e.Key, e.Value, options.MaxKValues))], options);
        var app = Build(catalog, options, address, logging);
        try
        {
            await app.StartAsync(cancellation).ConfigureAwait(false);
        }
        catch
        {
            await app.DisposeAsync().ConfigureAwait(false);
            catalog.Dispose();
            throw;
        }

        var bound = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        var logger = app.Services.GetRequiredService<ILoggerFactory>().CreateLogger<SibylServer>();
        foreach (var e in catalog.All)
        {
            ServerLog.Serving(logger, e.Summary());
        }

        return new SibylServer(app, catalog, new Uri(bound));
    }

    /// <summary>Completes when the server has stopped (by <see cref="StopAsync"/>, SIGINT or SIGTERM).</summary>
    public Task WaitForShutdownAsync(CancellationToken cancellation = default) => _app.WaitForShutdownAsync(cancellation);

    /// <summary>Stops listening and lets calls in flight finish (up to the shutdown timeout).</summary>
    public Task StopAsync(CancellationToken cancellation = default) => _app.StopAsync(cancellation);

    /// <summary>Stops the server and frees the predictors.</summary>
    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync().ConfigureAwait(false);
        await _app.DisposeAsync().ConfigureAwait(false);
        _catalog.Dispose();
    }

    private static WebApplication Build(EmulatorCatalog catalog, SibylServerOptions options, IPAddress address, Action<ILoggingBuilder>? logging)
    {
        // The content root is the program's folder, so a stray appsettings.json in the working directory changes nothing.
        var builder = WebApplication.CreateSlimBuilder(new WebApplicationOptions { Args = [], ContentRootPath = AppContext.BaseDirectory });
        builder.Logging.ClearProviders();
        logging?.Invoke(builder.Logging);
        builder.WebHost.ConfigureKestrel(kestrel =>
        {
            // Large batch replies would otherwise stall on HTTP/2 flow control at the default windows (under 1 MB).
            kestrel.Limits.Http2.InitialConnectionWindowSize = 16 * 1024 * 1024;
            kestrel.Limits.Http2.InitialStreamWindowSize = 16 * 1024 * 1024;
            kestrel.Listen(address, options.Port, listen => listen.Protocols = HttpProtocols.Http2);
        });
        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = options.ShutdownTimeout);
        builder.Services.Configure<ConsoleLifetimeOptions>(o => o.SuppressStatusMessages = true);
        builder.Services.AddGrpc(o =>
        {
            o.MaxReceiveMessageSize = options.MaxMessageBytes;
            o.MaxSendMessageSize = options.MaxMessageBytes;
        });
        // The check is what makes the health service answer SERVING: with no check registered it resolves every
        // service to UNKNOWN. It can only be healthy because the catalog is loaded before the server starts.
        builder.Services.AddGrpcHealthChecks(o => o.Services.Map(ServiceName, _ => true))
            .AddCheck("emulators", () => HealthCheckResult.Healthy($"{catalog.All.Count} emulator(s) loaded"));
        builder.Services.AddGrpcReflection();
        builder.Services.AddSingleton(catalog);
        var app = builder.Build();
        app.MapGrpcService<EmulatorService>();
        app.MapGrpcHealthChecksService();
        app.MapGrpcReflectionService();
        return app;
    }

    [GeneratedRegex("^[A-Za-z0-9._-]{1,64}$")]
    private static partial Regex NamePattern();
}
