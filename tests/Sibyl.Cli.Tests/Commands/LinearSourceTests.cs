using System.Globalization;

namespace Sibyl.Cli.Tests.Commands;

public class LinearSourceTests
{
    [Theory]
    [InlineData("linear", "linear=table", "linear: must be one of fit, boltzmann, got 'table'")]
    [InlineData("matter", "linear=table", "linear: must be one of fit, boltzmann, got 'table'")]
    [InlineData("galaxy", "linear=table", "linear: must be one of fit, boltzmann, got 'table'")]
    [InlineData("linear", "linear=Boltzmann", "linear: must be one of fit, boltzmann, got 'Boltzmann'")]
    [InlineData("linear", "linear=", "linear: must be one of fit, boltzmann, got ''")]
    [InlineData("linear", "N_eff=3.5", "N_eff: applies only to linear=boltzmann")]
    [InlineData("matter", "Y_He=0.25", "Y_He: applies only to linear=boltzmann")]
    [InlineData("linear", "N_eff=11", "N_eff: must be finite and lie in [0, 10], got 11")]
    [InlineData("linear", "Y_He=0.5", "Y_He: must be finite and lie in (0, 0.5), got 0.5")]
    public void Bad_linear_choices_get_one_line_naming_the_field_and_exit_code_2(string output, string argument, string expected)
    {
        var run = CliRun.Of("compute", output, argument);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: " + expected, run.Stderr, StringComparison.Ordinal);
        Assert.Single(run.Stderr.TrimEnd('\n').Split('\n'));
        Assert.Equal("", run.Stdout);
    }

    [Fact]
    public void Solver_only_parameters_are_refused_with_the_fit_named_explicitly()
    {
        var run = CliRun.Of("compute", "linear", "linear=fit", "N_eff=3.5");

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: N_eff: applies only to linear=boltzmann", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Solver_only_parameters_pass_with_linear_boltzmann()
    {
        // The first problem reported is the k range, checked after the parameters: so linear=boltzmann, N_eff and
        // Y_He were all accepted (had any been refused, the message would name it).
        var run = CliRun.Of("compute", "linear", "linear=boltzmann", "N_eff=2.5", "Y_He=0.3", "--kmin=0");

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: --kmin: must lie in", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void A_table_and_a_built_in_source_together_are_refused()
    {
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string table = Path.Combine(folder, "table.txt");
        File.WriteAllLines(table, Enumerable.Range(0, 20).Select(i => string.Create(CultureInfo.InvariantCulture, $"{1e-4 * Math.Pow(2, i):R} {1000.0 / (i + 1):R}")));

        var run = CliRun.Of("compute", "linear", "linear=boltzmann", "--table", table);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: linear: --table supplies the linear spectrum; give one or the other", run.Stderr, StringComparison.Ordinal);
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void Linear_fit_is_the_default()
    {
        var plain = CliRun.Of("compute", "linear", "--nk", "5");
        var fit = CliRun.Of("compute", "linear", "linear=fit", "--nk", "5");

        Assert.Equal(0, fit.ExitCode);
        Assert.Equal("k,P_lin,P_nw", fit.Stdout.Split('\n')[0]);
        Assert.Equal(plain.Stdout, fit.Stdout);
        Assert.Contains("linear=Eisenstein & Hu (1998) fit", fit.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_help_lists_the_sources_and_the_solver_only_parameters()
    {
        var run = CliRun.Of("compute", "--help");

        Assert.Contains("  linear      [fit] one of fit, boltzmann", run.Stdout, StringComparison.Ordinal);
        Assert.Contains("  N_eff       [3.046] in [0, 10]", run.Stdout, StringComparison.Ordinal);
        Assert.Contains("  Y_He        [0.2454] in (0, 0.5)", run.Stdout, StringComparison.Ordinal);
        Assert.Equal(2, run.Stdout.Split('\n').Count(l => l.EndsWith("linear=boltzmann only", StringComparison.Ordinal)));
    }

    [Fact]
    public void Linear_boltzmann_plots_and_tabulates_the_solver_against_the_fit()
    {
        string folder = Directory.CreateTempSubdirectory("sibyl-cli-").FullName;
        string png = Path.Combine(folder, "linear.png"), csv = Path.Combine(folder, "linear.csv");

        var run = CliRun.Of("compute", "linear", "linear=boltzmann", "z=0.5", "--kmin", "0.01", "--kmax", "0.5", "--nk", "41", "--plot", png, "--out", csv);
        var fitRun = CliRun.Of("compute", "linear", "z=0.5", "--kmin", "0.01", "--kmax", "0.5", "--nk", "41");

        Assert.Equal(0, run.ExitCode);
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, File.ReadAllBytes(png)[..4]);
        var lines = File.ReadAllLines(csv);
        Assert.Equal("k,P_lin,P_nw,P_lin_fit,P_nw_fit,P_lin_over_P_lin_fit", lines[0]);
        var rows = Rows(lines);
        var fitRows = Rows(fitRun.Stdout.TrimEnd('\n').Split('\n'));
        Assert.Equal(41, rows.Length);

        // At the k nearest 0.1 h/Mpc. The fit is good to a few per cent (Eisenstein & Hu 1998): 20 % catches gross
        // errors only (units, normalisation, growth).
        var near = rows.MinBy(r => Math.Abs(Math.Log(r[0] / 0.1)))!;
        Assert.InRange(near[5], 0.8, 1.2);
        for (int i = 0; i < rows.Length; i++)
        {
            // The ratio column is the ratio of the columns beside it, and the fit columns are what linear=fit prints
            // (same cosmology, same growth); 1e-12 covers the round trip through "R" formatting.
            Assert.Equal(rows[i][1] / rows[i][3], rows[i][5], 1e-12);
            Assert.Equal(fitRows[i][1], rows[i][3], fitRows[i][1] * 1e-12);
            Assert.Equal(fitRows[i][2], rows[i][4], fitRows[i][2] * 1e-12);
        }

        Assert.Contains(rows, r => Math.Abs(r[5] - 1.0) > 1e-6);
        Assert.Contains("r_drag=", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("sigma8(z)=", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("; fit: sigma8(z)=", run.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("linear=Eisenstein & Hu (1998) fit", run.Stderr, StringComparison.Ordinal);
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public void Linear_boltzmann_feeds_the_one_loop_outputs()
    {
        // The matter P_lin column is the solver's spectrum: within 20 % of the fit's at every k in [0.02, 0.3] h/Mpc
        // (the fit's accuracy is a few per cent), but not equal to it.
        string[] k = ["z=0.5", "--kmin", "0.02", "--kmax", "0.3", "--nk", "6"];
        var solver = CliRun.Of(["compute", "matter", "linear=boltzmann", .. k]);
        var fit = CliRun.Of(["compute", "matter", .. k]);
        var galaxy = CliRun.Of(["compute", "galaxy", "linear=boltzmann", .. k]);

        Assert.Equal(0, solver.ExitCode);
        Assert.Equal(0, galaxy.ExitCode);
        Assert.Equal(7, galaxy.Stdout.TrimEnd('\n').Split('\n').Length);
        var solverRows = Rows(solver.Stdout.TrimEnd('\n').Split('\n'));
        var fitRows = Rows(fit.Stdout.TrimEnd('\n').Split('\n'));
        for (int i = 0; i < solverRows.Length; i++)
        {
            Assert.InRange(solverRows[i][1] / fitRows[i][1], 0.8, 1.2);
        }

        Assert.NotEqual(fitRows[0][1], solverRows[0][1]);
    }

    [Fact]
    public void N_eff_reaches_the_solver()
    {
        string[] args = ["compute", "linear", "linear=boltzmann", "--kmin", "0.05", "--kmax", "0.2", "--nk", "3"];
        var standard = CliRun.Of(args);
        var more = CliRun.Of([.. args, "N_eff=4"]);

        Assert.Equal(0, more.ExitCode);
        Assert.NotEqual(standard.Stdout, more.Stdout);
    }

    private static double[][] Rows(IEnumerable<string> lines) =>
        lines.Skip(1).Select(l => l.Split(',').Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray()).ToArray();
}
