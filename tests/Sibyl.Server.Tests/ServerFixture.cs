extern alias server;

using server::Sibyl.Server;
using Sibyl.Client;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Server.Tests;

/// <summary>A real server on a free loopback port serving the fixture's emulators, and a client of it.</summary>
public sealed class ServerFixture : IAsyncLifetime
{
    /// <summary>The test server's batch limit: above the 5000-point batch test, low enough to test the refusal cheaply.</summary>
    public const int MaxBatch = 6000;

    /// <summary>The test server's limit on requested k values per point.</summary>
    public const int MaxKValues = 1000;

    private readonly EmulatorFixture _emulators = new();
    private SibylServer? _server;

    public SpectrumEmulator Slices => _emulators.Slices;

    public SpectrumEmulator RedshiftInput => _emulators.RedshiftInput;

    public Uri Address => _server!.Address;

    public SibylClient Client { get; private set; } = null!;

    public async Task InitializeAsync()
    {
        _server = await SibylServer.StartAsync(
            [new("slices", Slices), new("zin", RedshiftInput)],
            new SibylServerOptions { Port = 0, MaxBatch = MaxBatch, MaxKValues = MaxKValues });
        Client = new SibylClient(_server.Address);
    }

    public async Task DisposeAsync()
    {
        Client.Dispose();
        if (_server is not null)
        {
            await _server.DisposeAsync();
        }

        _emulators.Dispose();
    }
}
