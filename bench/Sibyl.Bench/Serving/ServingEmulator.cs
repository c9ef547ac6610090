using Sibyl.Emulation.Emulators;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Bench.Serving;

/// <summary>
/// The emulator every serving benchmark uses: training-grids/quick-lcdm.json (3 parameters, 2 redshift slices, 30 k,
/// 40 training points, basis terms P_tree_plus_loop and P_ct_basis) fitted with variances. Trained once per machine
/// into the temporary folder and reused, so that each benchmark process only loads it.
/// </summary>
internal static class ServingEmulator
{
    public static SpectrumEmulator Load()
    {
        string folder = Path.Combine(Path.GetTempPath(), "sibyl-bench-serving");
        string path = Path.Combine(folder, "quick-lcdm.emulator");
        if (File.Exists(path))
        {
            try
            {
                return SpectrumEmulator.Load(path);
            }
            catch (CorruptFileException)
            {
                // Written by another build's format: train again below.
            }
        }

        var design = TrainingDesign.Create(GridSpecReader.ReadFile(Path.Combine(AppContext.BaseDirectory, "quick-lcdm.json")));
        string run = Path.Combine(folder, "quick-lcdm.run");
        new TrainingRun(design, run, ShardSelection.All, Environment.ProcessorCount, retryFailed: false).Execute(null, null, CancellationToken.None);
        var emulator = EmulatorFitter.Fit(TrainingSetMerger.Merge(design, [run]), new EmulatorFitOptions { KeepVariance = true }, null);
        emulator.Save(path);
        return emulator;
    }

    /// <summary>A point inside the box at z = 0.5 with a counterterm, as a sampler would send it.</summary>
    public static V1.PredictRequest Request(int i = 0)
    {
        var request = new V1.PredictRequest { Emulator = "quick", Z = 0.5 };
        double u = ((i * 0.618034) + 0.1) % 1.0;
        request.Parameters.Add(new Dictionary<string, double> { ["omega_cdm"] = 0.10 + (0.04 * u), ["h"] = 0.68, ["sigma8"] = 0.8 });
        request.Nuisance.Add("cs2", 1.0);
        return request;
    }
}
