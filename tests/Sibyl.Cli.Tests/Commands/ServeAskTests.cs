using System.Globalization;
using Sibyl.Emulation.Emulators;
using Sibyl.Server;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Cli.Tests.Commands;

/// <summary>
/// <c>sibyl ask</c> against a real server on a free loopback port (started in process, as <c>sibyl serve</c> does, but
/// stoppable without a signal), and the bad-input behaviour of both commands.
/// </summary>
public sealed class ServeAskTests : IAsyncLifetime
{
    private const string Spec = """
        {
          "name": "ask-tiny", "output": "matter", "model": "lcdm",
          "vary": { "sigma8": [0.72, 0.90], "z": [0.3, 1.0] },
          "k": { "min": 0.02, "max": 0.2, "count": 8 },
          "points": { "training": 12, "heldout": 3 }, "seed": 3, "chunk_size": 8
        }
        """;

    private readonly string _folder = Path.Combine(Path.GetTempPath(), $"sibyl-ask-tests-{Guid.NewGuid():N}");
    private SpectrumEmulator _emulator = null!;
    private SibylServer _server = null!;

    public async Task InitializeAsync()
    {
        var design = TrainingDesign.Create(GridSpecReader.Parse(Spec, "ask-tiny"));
        new TrainingRun(design, _folder, ShardSelection.All, Environment.ProcessorCount, retryFailed: false).Execute(null, null, CancellationToken.None);
        _emulator = EmulatorFitter.Fit(TrainingSetMerger.Merge(design, [_folder]), new EmulatorFitOptions { Restarts = 0, TrendDegree = 1 }, null);
        _server = await SibylServer.StartAsync([new("tiny", _emulator)], new SibylServerOptions { Port = 0 });
    }

    public async Task DisposeAsync()
    {
        await _server.DisposeAsync();
        Directory.Delete(_folder, recursive: true);
    }

    [Fact]
    public void Ask_prints_the_served_spectrum_as_a_csv_equal_to_the_emulator_in_process()
    {
        // Round-trip printing ("R") and an identical computation on the server: exact equality.
        var run = CliRun.Of("ask", "tiny", "sigma8=0.8", "z=0.6", "cs2=2", "--server", Server());
        Assert.Equal(0, run.ExitCode);
        var lines = run.Stdout.TrimEnd('\n').Split('\n');
        Assert.Equal("k,P", lines[0]);
        var spectra = _emulator.CreatePredictor().Predict([0.8, 0.6]);
        var expected = new double[_emulator.K.Count];
        spectra.Assemble([2.0], 0, expected);
        for (int i = 0; i < expected.Length; i++)
        {
            var cells = lines[i + 1].Split(',');
            Assert.Equal(_emulator.K[i], double.Parse(cells[0], CultureInfo.InvariantCulture));
            Assert.Equal(expected[i], double.Parse(cells[1], CultureInfo.InvariantCulture));
        }
    }

    [Fact]
    public void Ask_outside_the_box_exits_2_naming_the_parameter_and_its_range()
    {
        var run = CliRun.Of("ask", "tiny", "sigma8=0.95", "z=0.6", "--server", Server());
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("sigma8", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("[0.72, 0.9]", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Ask_with_no_server_listening_exits_1()
    {
        // Port 1 on loopback: nothing listens there, so the connection is refused at once.
        var run = CliRun.Of("ask", "tiny", "sigma8=0.8", "z=0.6", "--server", "http://127.0.0.1:1", "--timeout", "10");
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("Unavailable", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Serve_refuses_a_missing_emulator_file_and_unknown_options_with_exit_code_2()
    {
        Assert.Equal(2, CliRun.Of("serve").ExitCode);
        var missing = CliRun.Of("serve", "quick=" + Path.Combine(_folder, "none.emulator"));
        Assert.Equal(2, missing.ExitCode);
        Assert.Contains("not found", missing.Stderr, StringComparison.Ordinal);
        Assert.Equal(2, CliRun.Of("serve", "quick=x.emulator", "--bogus", "1").ExitCode);
        Assert.Equal(2, CliRun.Of("serve", "quick=x.emulator", "--port", "70000").ExitCode);
    }

    private string Server() => _server.Address.GetLeftPart(UriPartial.Authority);
}
