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

    [Theory]
    [InlineData("matter", "--kmin", "2e-5")]
    [InlineData("galaxy", "--kmax", "50")]
    public void One_loop_outputs_refuse_k_too_close_to_the_table_edges(string output, string option, string value)
    {
        var run = CliRun.Of("compute", output, option, value);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: --kmin/--kmax: one-loop outputs need k in [0.0001, 10] h/Mpc", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void User_table_feeds_the_one_loop_outputs()
    {
        // A table written by compute linear at z = 0 over 1e-5–50 h/Mpc and read back (after a comment line
        // and a header) must give back the fitting formula's matter spectrum within the loops' truncation
        // at the table's smaller upper end and the spline error between its 2000 nodes: 1e-3.
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string csv = Path.Combine(folder, "linear.csv");
        Assert.Equal(0, CliRun.Of("compute", "linear", "--kmin", "1e-5", "--kmax", "50", "--nk", "2000", "--out", csv).ExitCode);
        string table = Path.Combine(folder, "table.txt");
        File.WriteAllLines(table, new[] { "# invented test table" }.Concat(File.ReadAllLines(csv).Select(l => string.Join(' ', l.Split(',').Take(2)))));

        var fromTable = CliRun.Of("compute", "matter", "--table", table, "--kmin", "0.01", "--kmax", "0.3", "--nk", "5");
        var fromFit = CliRun.Of("compute", "matter", "--kmin", "0.01", "--kmax", "0.3", "--nk", "5");
        var galaxy = CliRun.Of("compute", "galaxy", "--table", table, "--kmin", "0.01", "--kmax", "0.3", "--nk", "3");

        Assert.Equal(0, fromTable.ExitCode);
        Assert.Equal(0, galaxy.ExitCode);
        var a = fromTable.Stdout.TrimEnd('\n').Split('\n').Skip(1).Select(l => double.Parse(l.Split(',')[6], CultureInfo.InvariantCulture)).ToArray();
        var b = fromFit.Stdout.TrimEnd('\n').Split('\n').Skip(1).Select(l => double.Parse(l.Split(',')[6], CultureInfo.InvariantCulture)).ToArray();
        for (int i = 0; i < a.Length; i++)
        {
            Assert.Equal(1.0, a[i] / b[i], 1e-3);
        }

        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void Missing_output_folder_is_reported_before_any_work()
    {
        string missing = Path.Combine(Path.GetTempPath(), "sibyl-" + Guid.NewGuid().ToString("N"), "p.csv");
        var run = CliRun.Of("compute", "matter", "--out", missing);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: --out: folder", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Flag_options_take_no_value()
    {
        var run = CliRun.Of("compute", "galaxy", "--basis=no");

        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--basis: takes no value", run.Stderr, StringComparison.Ordinal);
    }
}
