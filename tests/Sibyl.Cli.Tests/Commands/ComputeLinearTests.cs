using System.Globalization;

namespace Sibyl.Cli.Tests.Commands;

public class ComputeLinearTests
{
    [Theory]
    [InlineData("foo=1", "foo: unknown parameter")]
    [InlineData("h=", "h: missing value")]
    [InlineData("h=abc", "h: 'abc' is not a number")]
    [InlineData("h=nan", "h: must be finite")]
    [InlineData("sigma8=Infinity", "sigma8: must be finite")]
    [InlineData("sigma8=inf", "sigma8: 'inf' is not a number")]
    [InlineData("h=0", "h: must be finite and lie in (0, 2]")]
    [InlineData("h=-0.7", "h: must be finite and lie in (0, 2]")]
    [InlineData("omega_b=-0.01", "omega_b: must be finite and lie in (0, 0.1]")]
    [InlineData("sigma8=0", "sigma8: must be finite and lie in (0, 2]")]
    [InlineData("Omega_rc=-0.1", "Omega_rc: must be finite and lie in [0, 100]")]
    [InlineData("z=-0.5", "z: must be finite and lie in [0, 20]")]
    [InlineData("model=fr", "model: must be one of lcdm, ndgp, qs")]
    [InlineData("wa=1.5", "wa: w0 + wa must be < 0")]
    [InlineData("mu0=0.1", "mu0: applies only to model=qs")]
    [InlineData("--kmin=0", "--kmin: must lie in")]
    [InlineData("--colour=red", "--colour: unknown option")]
    public void Bad_input_gets_one_line_naming_the_parameter_and_exit_code_2(string argument, string expected)
    {
        // Omega_rc needs its model for the range check to be reached.
        string[] args = argument.StartsWith("Omega_rc", StringComparison.Ordinal)
            ? ["compute", "linear", "model=ndgp", argument]
            : ["compute", "linear", argument];

        var run = CliRun.Of(args);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: " + expected, run.Stderr, StringComparison.Ordinal);
        Assert.Single(run.Stderr.TrimEnd('\n').Split('\n'));
        Assert.DoesNotContain("\n   at ", run.Stderr, StringComparison.Ordinal);
        Assert.Equal("", run.Stdout);
    }

    [Fact]
    public void Both_ln10As_and_sigma8_are_refused()
    {
        var run = CliRun.Of("compute", "linear", "ln10As=3.0", "sigma8=0.8");

        Assert.Equal(2, run.ExitCode);
        Assert.Contains("either ln10As or sigma8", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Linear_output_has_header_and_requested_rows_and_reports_growth()
    {
        var run = CliRun.Of("compute", "linear", "z=0.5", "model=ndgp", "Omega_rc=0.25", "--kmin", "0.01", "--kmax", "0.5", "--nk", "7");

        Assert.Equal(0, run.ExitCode);
        var lines = run.Stdout.TrimEnd('\n').Split('\n');
        Assert.Equal("k,P_lin,P_nw", lines[0]);
        Assert.Equal(8, lines.Length);
        Assert.Equal(0.01, double.Parse(lines[1].Split(',')[0], CultureInfo.InvariantCulture), 1e-15);
        Assert.Equal(0.5, double.Parse(lines[^1].Split(',')[0], CultureInfo.InvariantCulture), 1e-15);
        Assert.Contains("model=ndgp", run.Stderr, StringComparison.Ordinal);
        Assert.Contains(" D=", run.Stderr, StringComparison.Ordinal);
        Assert.Contains(" f=", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Out_option_writes_the_csv_to_a_file_and_leaves_no_temporary_behind()
    {
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string path = Path.Combine(folder, "linear.csv");

        var run = CliRun.Of("compute", "linear", "--nk", "5", "--out", path);

        Assert.Equal(0, run.ExitCode);
        Assert.Equal(6, File.ReadAllLines(path).Length);
        Assert.Single(Directory.GetFiles(folder));
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void User_table_is_used_and_k_outside_it_is_refused()
    {
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string full = Path.Combine(folder, "full.csv");
        Assert.Equal(0, CliRun.Of("compute", "linear", "--kmin", "1e-4", "--kmax", "5", "--nk", "400", "--out", full).ExitCode);
        string table = Path.Combine(folder, "table.txt");
        File.WriteAllLines(table, File.ReadAllLines(full).Select(l => string.Join(' ', l.Split(',').Take(2))));

        var inside = CliRun.Of("compute", "linear", "--table", table, "--kmin", "0.01", "--kmax", "1", "--nk", "4");
        var outside = CliRun.Of("compute", "linear", "--table", table, "--kmax", "10");

        Assert.Equal(0, inside.ExitCode);
        Assert.Contains("linear=user table", inside.Stderr, StringComparison.Ordinal);
        Assert.Equal(2, outside.ExitCode);
        Assert.Contains("the table covers k in", outside.Stderr, StringComparison.Ordinal);
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void Compute_help_lists_every_parameter_with_its_default()
    {
        var run = CliRun.Of("compute", "--help");

        Assert.Equal(0, run.ExitCode);
        foreach (var name in new[] { "h ", "omega_b", "omega_cdm", "n_s", "ln10As", "sigma8", "w0", "wa", "Omega_rc", "mu0", "vertex2", "vertex3", "z ", "model", "cs2" })
        {
            Assert.Contains("  " + name, run.Stdout, StringComparison.Ordinal);
        }

        Assert.Contains("[0.6766]", run.Stdout, StringComparison.Ordinal);
    }
}
