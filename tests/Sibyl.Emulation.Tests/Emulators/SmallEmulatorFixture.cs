using Sibyl.Emulation.Emulators;
using Sibyl.Training;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Emulation.Tests.Emulators;

/// <summary>
/// A real but small emulator, built once for the emulator tests: the one-loop matter spectrum over two ΛCDM
/// parameters at two redshifts, 40 training and 10 held-out points, 12 k values; fitted with variances kept.
/// </summary>
public sealed class SmallEmulatorFixture : IDisposable
{
    private const string Spec = """
        {
          "name": "emulator-tests",
          "output": "matter",
          "model": "lcdm",
          "vary": { "omega_cdm": [0.11, 0.13], "sigma8": [0.75, 0.85] },
          "redshifts": [0.5, 1.0],
          "k": { "min": 0.01, "max": 0.3, "count": 12 },
          "points": { "training": 40, "heldout": 10 },
          "seed": 11,
          "chunk_size": 5
        }
        """;

    private readonly string _folder = Path.Combine(Path.GetTempPath(), $"sibyl-emulator-tests-{Guid.NewGuid():N}");

    public SmallEmulatorFixture()
    {
        var design = TrainingDesign.Create(GridSpecReader.Parse(Spec, "emulator test spec"));
        new TrainingRun(design, _folder, ShardSelection.All, Environment.ProcessorCount, retryFailed: false).Execute(null, null, CancellationToken.None);
        Set = TrainingSetMerger.Merge(design, [_folder]);
        Emulator = EmulatorFitter.Fit(Set, new EmulatorFitOptions { KeepVariance = true }, null);
    }

    public TrainingSet Set { get; }

    public SpectrumEmulator Emulator { get; }

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }
}
