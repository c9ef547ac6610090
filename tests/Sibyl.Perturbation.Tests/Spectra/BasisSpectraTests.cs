using Sibyl.Perturbation.Spectra;

namespace Sibyl.Perturbation.Tests.Spectra;

public class BasisSpectraTests
{
    private static readonly BasisLayout Layout = new(
        ["P0", "P2"],
        ["b1", "b2"],
        [
            new BasisTerm("one", 0, 1.0, []),
            new BasisTerm("b1b1", 0, 1.0, [0, 0]),
            new BasisTerm("b1b2", 1, -2.0, [0, 1]),
        ]);

    [Fact]
    public void Assembly_is_exactly_the_sum_of_coefficients_times_terms()
    {
        var spectra = new BasisSpectra(Layout, [0.1, 0.2], [1, 2, 10, 20, 100, 200]);
        Span<double> p0 = stackalloc double[2];
        Span<double> p2 = stackalloc double[2];

        spectra.Assemble([3.0, 5.0], 0, p0);
        spectra.Assemble([3.0, 5.0], 1, p2);

        Assert.Equal(1 + 9 * 10, p0[0]);
        Assert.Equal(2 + 9 * 20, p0[1]);
        Assert.Equal(-2 * 15 * 100, p2[0]);
    }

    [Fact]
    public void Layout_rejects_a_term_pointing_at_a_missing_parameter()
    {
        Assert.Throws<ArgumentException>(() => new BasisLayout(["P"], ["cs2"], [new BasisTerm("x", 0, 1, [1])]));
    }

    [Fact]
    public void Spectra_reject_data_of_the_wrong_size()
    {
        Assert.Throws<ArgumentException>(() => new BasisSpectra(Layout, [0.1, 0.2], [1, 2, 3]));
    }
}
