using System.Globalization;

namespace Sibyl.Cli.Tests.Commands;

/// <summary>
/// A temporary folder holding a small matter grid spec (two varied parameters, 12 k values in [0.01, 0.3]
/// h/Mpc), deleted on dispose; <c>{training}</c>, <c>{heldout}</c>, <c>{chunk}</c> and <c>{extra}</c> in the spec are filled in.
/// </summary>
internal sealed class TrainingFolder : IDisposable
{
    private const string Template = """
        {
          "name": "cli-grid",
          "output": "matter",
          "vary": { "omega_cdm": [0.11, 0.13], "h": [0.65, 0.70] },
          "fixed": { "omega_b": 0.0224 },
          "redshifts": [0.5],
          "k": { "min": 0.01, "max": 0.3, "count": 12 },
          "points": { "training": {training}, "heldout": {heldout} },
          "seed": 11,
          "chunk_size": {chunk}{extra}
        }
        """;

    public TrainingFolder(int training = 4, int heldOut = 2, int chunkSize = 2, string extra = "")
    {
        Path = Directory.CreateTempSubdirectory("sibyl-cli-training-").FullName;
        System.IO.File.WriteAllText(Spec, Template
            .Replace("{training}", training.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{heldout}", heldOut.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{chunk}", chunkSize.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{extra}", extra, StringComparison.Ordinal));
    }

    public string Path { get; }

    public string Spec => File("grid.json");

    public string Design => File("grid.design");

    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Runs <c>sibyl plan</c> on the spec into <see cref="Design"/> and checks that it succeeded.</summary>
    public void Plan() => Assert.Equal(0, CliRun.Of("plan", Spec, "--out", Design).ExitCode);

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
