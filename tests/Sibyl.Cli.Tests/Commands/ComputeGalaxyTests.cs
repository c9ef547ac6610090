using System.Globalization;

namespace Sibyl.Cli.Tests.Commands;

public class ComputeGalaxyTests
{
    [Fact]
    public void Galaxy_output_has_multipoles_and_with_basis_every_term()
    {
        var plain = CliRun.Of("compute", "galaxy", "z=1", "b1=1.9", "--kmin", "0.02", "--kmax", "0.2", "--nk", "4");
        var basis = CliRun.Of("compute", "galaxy", "z=1", "b1=1.9", "--kmin", "0.02", "--kmax", "0.2", "--nk", "4", "--basis");

        Assert.Equal(0, plain.ExitCode);
        Assert.Equal("k,P0,P2,P4", plain.Stdout.Split('\n')[0]);
        Assert.Equal(5, plain.Stdout.TrimEnd('\n').Split('\n').Length);
        var header = basis.Stdout.Split('\n')[0].Split(',');
        Assert.Contains("P0_b1b1", header);
        Assert.Contains("P4_bG2bG2", header);
        Assert.Contains("P2_stoch_k2mu2", header);
        Assert.Equal(
            plain.Stdout.Split('\n')[1],
            string.Join(',', basis.Stdout.Split('\n')[1].Split(',').Take(4)));
    }

    [Fact]
    public void Stochastic_constant_adds_to_the_monopole_only()
    {
        // P_stoch = stoch0 enters P0 alone (its μ average is itself, higher multipoles vanish). Values of
        // order 1e4 (Mpc/h)³ written with round-trip precision: 1e-8 absolute is far above their rounding.
        var without = Rows(CliRun.Of("compute", "galaxy", "--nk", "3", "--kmin", "0.05", "--kmax", "0.1"));
        var with = Rows(CliRun.Of("compute", "galaxy", "stoch0=500", "--nk", "3", "--kmin", "0.05", "--kmax", "0.1"));

        for (int i = 0; i < without.Length; i++)
        {
            Assert.Equal(without[i][1] + 500.0, with[i][1], 1e-8);
            Assert.Equal(without[i][2], with[i][2], 1e-8);
            Assert.Equal(without[i][3], with[i][3], 1e-8);
        }
    }

    [Theory]
    [InlineData("b1=0", "b1: must be finite and lie in (0, 10]")]
    [InlineData("bG2=abc", "bG2: 'abc' is not a number")]
    [InlineData("c0=1e9", "c0: must be finite and lie in [-1000, 1000]")]
    [InlineData("cs2=1", "cs2: unknown parameter")]
    public void Bad_nuisance_values_are_refused_with_exit_code_2(string argument, string expected)
    {
        var run = CliRun.Of("compute", "galaxy", argument);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("sibyl: " + expected, run.Stderr, StringComparison.Ordinal);
    }

    private static double[][] Rows(CliRun run) =>
        run.Stdout.TrimEnd('\n').Split('\n').Skip(1)
            .Select(l => l.Split(',').Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray()).ToArray();
}
