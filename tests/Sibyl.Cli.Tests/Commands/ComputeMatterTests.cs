using System.Globalization;

namespace Sibyl.Cli.Tests.Commands;

public class ComputeMatterTests
{
    [Fact]
    public void Matter_output_has_the_documented_columns_and_total_is_linear_in_cs2()
    {
        // P_total = P_tree_ir + P_22 + P_13 − 2 cs2 P_ct_basis, column by column (the issue's definition);
        // 1e-9 relative covers the round trip through "R" formatting.
        var run = CliRun.Of("compute", "matter", "z=0.5", "cs2=2.5", "--kmin", "0.01", "--kmax", "0.3", "--nk", "6");

        Assert.Equal(0, run.ExitCode);
        var lines = run.Stdout.TrimEnd('\n').Split('\n');
        Assert.Equal("k,P_lin,P_tree_ir,P_22,P_13,P_ct_basis,P_total", lines[0]);
        Assert.Equal(7, lines.Length);
        foreach (var line in lines.Skip(1))
        {
            var v = line.Split(',').Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray();
            double expected = v[2] + v[3] + v[4] - 2.0 * 2.5 * v[5];
            Assert.Equal(expected, v[6], Math.Abs(expected) * 1e-9);
        }

        Assert.Contains("Sigma=", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Out_of_range_sound_speed_is_refused_with_its_range()
    {
        var run = CliRun.Of("compute", "matter", "cs2=5000");

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: cs2: must be finite and lie in [-1000, 1000]", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Plot_option_writes_a_png_beside_the_csv()
    {
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string png = Path.Combine(folder, "matter.png");

        var run = CliRun.Of("compute", "matter", "--nk", "20", "--plot", png);

        Assert.Equal(0, run.ExitCode);
        var bytes = File.ReadAllBytes(png);
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, bytes[..4]);
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void Plot_path_must_be_a_png()
    {
        var run = CliRun.Of("compute", "matter", "--plot", "figure.jpg");

        Assert.Equal(2, run.ExitCode);
        Assert.Contains("must end in .png", run.Stderr, StringComparison.Ordinal);
    }
}
