using System.Text.Json;
using Sibyl.Training.Design;
using Sibyl.Training.Linear;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Linear;

public class ExternalLinearProviderTests
{
    [Fact]
    public void A_program_printing_the_fit_gives_the_spectra_of_the_fit()
    {
        using var folder = new TemporaryFolder();
        var direct = ProviderSpec.Direct();
        string table = folder.File("linear.txt");
        ProviderSpec.WriteTable(table);
        var external = ProviderSpec.With(["sh", "-c", $"cat > /dev/null; cat '{table}'"], 30);

        var fromProgram = Merge(external, folder.Folder("program.run"), out var summary);
        var fromFit = Merge(direct, folder.Folder("fit.run"), out _);

        Assert.Empty(summary.Failures);
        double worst = 0.0;
        for (int i = 0; i < 2; i++)
        {
            var a = fromProgram.Spectra(i, 0);
            var b = fromFit.Spectra(i, 0);
            for (int t = 0; t < a.Layout.Terms.Count; t++)
            {
                // Relative to the term's largest magnitude, as loop terms cross zero.
                double scale = b.Term(t).ToArray().Max(Math.Abs);
                for (int j = 0; j < a.K.Length; j++)
                {
                    worst = Math.Max(worst, Math.Abs(a.Term(t)[j] - b.Term(t)[j]) / scale);
                }
            }
        }

        // Two differences remain: the cubic-spline resampling of a 400-row table (Δln k = 0.033, through the BAO
        // wiggles) and the loops' integration range, [1e-4, 50] h/Mpc for the program against [1e-5, 100] for
        // the fit. Measured: 6e-6 of each term's largest value; 3e-5 leaves a factor 5. A table read in the wrong
        // units or at the wrong redshift would be off at order unity.
        Assert.True(worst < 3e-5, $"largest difference {worst} of the term's scale");

        // Bit-identical spectra would mean the program's table was never used.
        Assert.True(worst > 0, "the spectra equal the fit's exactly");
    }

    [Theory]
    [InlineData("sh|-c|sleep 5", "linear program 'sh' timed out after 1 s and was killed")]
    [InlineData("sh|-c|cat > /dev/null; echo 'no table for this cosmology' >&2; exit 1", "linear program 'sh' exited with code 1: no table for this cosmology")]
    [InlineData("sh|-c|cat > /dev/null; printf '0.0001 1\\nnot two numbers\\n'", "output of linear program 'sh' line 2: expected two numbers k, P, got 'not two numbers'")]
    [InlineData("sh|-c|cat > /dev/null; printf '0.01 100\\n0.1 50\\n'", "linear program 'sh' returned k in [0.01, 0.1] h/Mpc; the grid needs at least [0.0001, 50]")]
    [InlineData("sibyl-test-no-such-program", "linear program 'sibyl-test-no-such-program' could not start")]
    public void A_failing_program_is_recorded_as_a_failed_point_with_its_reason(string command, string error)
    {
        using var folder = new TemporaryFolder();
        var spec = ProviderSpec.With(command.Split('|'), 1);

        var set = Merge(spec, folder.Folder("failing.run"), out var summary);

        Assert.Equal([0, 1], summary.Failures.Select(f => f.Index));
        Assert.All(summary.Failures, f => Assert.StartsWith(error, f.Error, StringComparison.Ordinal));
        Assert.StartsWith(error, set.Error(1), StringComparison.Ordinal);
        Assert.Throws<InvalidOperationException>(() => set.Spectra(1, 0));
    }

    [Fact]
    public void The_program_reads_the_parameters_of_its_point_on_stdin()
    {
        var spec = SpecText.Spec("linear={\"command\": [\"x\"], \"k_min\": 2e-4, \"k_max\": 40}", "fixed={\"omega_b\": 0.0221, \"n_s\": 0.95, \"w0\": -0.9, \"wa\": 0.1}");
        var design = TrainingDesign.Create(spec);
        var point = design.Point(3);
        var provider = new ExternalLinearProvider(spec.Linear!);

        using var request = JsonDocument.Parse(provider.Request(GridPoint.Cosmology(spec, point), 3));
        var root = request.RootElement;

        // JSON numbers are written shortest-round-trip, so every value comes back exactly.
        Assert.Equal(3, root.GetProperty("point").GetInt32());
        Assert.Equal(point[0], root.GetProperty("omega_cdm").GetDouble());
        Assert.Equal(point[1], root.GetProperty("h").GetDouble());
        Assert.Equal(0.0221, root.GetProperty("omega_b").GetDouble());
        Assert.Equal(0.95, root.GetProperty("n_s").GetDouble());
        Assert.Equal(-0.9, root.GetProperty("w0").GetDouble());
        Assert.Equal(0.1, root.GetProperty("wa").GetDouble());
        Assert.Equal(0.8102, root.GetProperty("sigma8").GetDouble());
        Assert.Equal(2.7255, root.GetProperty("T_cmb").GetDouble());
        Assert.Equal(2e-4, root.GetProperty("k_min").GetDouble());
        Assert.Equal(40, root.GetProperty("k_max").GetDouble());
        Assert.False(root.TryGetProperty("ln10As", out _));
    }

    private static TrainingSet Merge(GridSpec spec, string folder, out RunSummary summary)
    {
        var design = TrainingDesign.Create(spec);
        summary = new TrainingRun(design, folder, ShardSelection.All, threads: 2, retryFailed: false).Execute(null, null, CancellationToken.None);
        return TrainingSetMerger.Merge(design, [folder]);
    }
}
