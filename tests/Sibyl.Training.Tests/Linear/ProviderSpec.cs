using System.Globalization;
using System.Text.Json;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Linear;

/// <summary>
/// A matter spec whose only varied parameter is z, so every point has the same cosmology and one linear table
/// serves them all: 2 points in chunks of 1, 12 k values in [0.01, 0.3] h/Mpc.
/// </summary>
internal static class ProviderSpec
{
    public static GridSpec Direct() => SpecText.Spec(Edits());

    public static GridSpec With(IEnumerable<string> command, double timeoutSeconds) =>
        SpecText.Spec([.. Edits(), $"linear={{\"command\": {JsonSerializer.Serialize(command)}, \"timeout_seconds\": {timeoutSeconds:R}, \"k_min\": 1e-4, \"k_max\": 50}}"]);

    /// <summary>
    /// Writes the Eisenstein &amp; Hu fit's P_L(k, z = 0) of the spec's cosmology, 400 rows log-spaced over
    /// [1e-4, 50] h/Mpc, as a linear program would print it.
    /// </summary>
    public static void WriteTable(string path)
    {
        // P_L(k, 0) = D(0)² Shape(k), as CosmologyModel.LinearPower computes it, with the growth solved once, not per row.
        var model = CosmologyModel.Create(GridPoint.Cosmology(Direct(), [0.5]));
        double growth = model.Growth(0).D;
        File.WriteAllLines(path, LogGridFunction.LogGrid(1e-4, 50, 400).Select(k => string.Create(CultureInfo.InvariantCulture, $"{k:R} {growth * growth * model.Linear.Shape.Evaluate(k):R}")));
    }

    private static string[] Edits() =>
    [
        "vary={\"z\": [0.2, 0.8]}",
        "fixed={\"omega_b\": 0.0224, \"omega_cdm\": 0.12, \"h\": 0.67}",
        "redshifts=",
        "points={\"training\": 2, \"heldout\": 0}",
        "chunk_size=1",
    ];
}
