using Sibyl.Emulation.Emulators;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Server.Tests;

/// <summary>
/// Two small emulators trained once for the whole test collection (a few seconds on 2 cores): "slices", a matter
/// emulator over (omega_cdm, sigma8) at fixed redshifts 0.5 and 1 with variances, and "zin", one with z among its
/// inputs and no variances. Accuracy is not the point here: every test compares the server with the same emulator
/// evaluated in process.
/// </summary>
public sealed class EmulatorFixture : IDisposable
{
    private const string SlicesSpec = """
        {
          "name": "server-slices", "output": "matter", "model": "lcdm",
          "vary": { "omega_cdm": [0.10, 0.14], "sigma8": [0.72, 0.90] },
          "redshifts": [0.5, 1.0],
          "k": { "min": 0.01, "max": 0.3, "count": 60 },
          "points": { "training": 40, "heldout": 10 }, "seed": 7, "chunk_size": 8
        }
        """;

    private const string RedshiftInputSpec = """
        {
          "name": "server-zin", "output": "matter", "model": "lcdm",
          "vary": { "sigma8": [0.72, 0.90], "z": [0.3, 1.0] },
          "k": { "min": 0.02, "max": 0.2, "count": 12 },
          "points": { "training": 16, "heldout": 4 }, "seed": 8, "chunk_size": 8
        }
        """;

    private readonly string _folder = Path.Combine(Path.GetTempPath(), $"sibyl-server-tests-{Guid.NewGuid():N}");

    public EmulatorFixture()
    {
        Slices = Train(SlicesSpec, "slices", variance: true);
        RedshiftInput = Train(RedshiftInputSpec, "zin", variance: false);
    }

    public SpectrumEmulator Slices { get; }

    public SpectrumEmulator RedshiftInput { get; }

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    private SpectrumEmulator Train(string json, string name, bool variance)
    {
        var design = TrainingDesign.Create(GridSpecReader.Parse(json, name));
        string run = Path.Combine(_folder, name);
        new TrainingRun(design, run, ShardSelection.All, Environment.ProcessorCount, retryFailed: false).Execute(null, null, CancellationToken.None);
        var set = TrainingSetMerger.Merge(design, [run]);
        return EmulatorFitter.Fit(set, new EmulatorFitOptions { KeepVariance = variance, Restarts = 0 }, null);
    }
}
