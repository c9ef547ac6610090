using BenchmarkDotNet.Attributes;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Bench.Training;

/// <summary>
/// Training throughput: a whole run of <see cref="Points"/> matter points of the 7-parameter nDGP box of
/// training-grids/matter-ndgp.json (60 k values), chunk files included, on 1 and 2 threads. Points per second
/// = Points / mean time. Each iteration starts from an empty run folder, so nothing is resumed; the quadrature
/// plans, built once per run whatever its length, are built in the iteration setup.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class TrainingRunBenchmark
{
    private const int Points = 32;

    private TrainingDesign _design = null!;
    private TrainingRun _run = null!;
    private string _folder = "";

    /// <summary>Worker threads.</summary>
    [Params(1, 2)]
    public int Threads { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        string specPath = Path.Combine(AppContext.BaseDirectory, "matter-ndgp.json");
        var spec = GridSpecReader.ReadFile(specPath) with { TrainingPoints = Points, HeldOutPoints = 0 };
        _design = TrainingDesign.Create(spec);
        _folder = Path.Combine(Path.GetTempPath(), $"sibyl-bench-{Guid.NewGuid():N}");
    }

    [IterationSetup]
    public void EmptyFolder()
    {
        DeleteFolder();
        _run = new TrainingRun(_design, _folder, ShardSelection.All, Threads, retryFailed: false);
    }

    [GlobalCleanup]
    public void DeleteFolder()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Benchmark(Description = "run of 32 matter points, chunks written")]
    public RunSummary Run() => _run.Execute(null, null, CancellationToken.None);
}
