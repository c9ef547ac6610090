using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

public sealed class LoopQuadratureValidationTests
{
    public static TheoryData<double[], string> BadGrids() => new()
    {
        { [], "At least one" },
        { [0.1, double.NaN], "k[1] = NaN" },
        { [-0.1], "k[0] = -0.1" },
        { [0.1, 0.1], "k[1] = 0.1" },
        { [0.2, 0.1], "k[1] = 0.1" },
        { [0.1, 20.0], "k[1] = 20" },
        { [5e-5, 0.1], "k[0] = 5E-05" },
    };

    [Theory]
    [MemberData(nameof(BadGrids))]
    public void Output_grid_must_be_finite_positive_increasing_and_inside_the_table(double[] k, string expected)
    {
        var error = Assert.Throws<ArgumentException>(() => new LoopQuadrature(k));
        Assert.Equal("k", error.ParamName);
        Assert.Contains(expected, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Spectrum_on_another_table_range_is_rejected()
    {
        var plan = new LoopQuadrature([0.1]);
        var other = new LogSampledSpectrum(InventedSpectra.Smooth, 1e-4, 100.0, 512);
        var error = Assert.Throws<ArgumentException>(() => plan.Compute(other, new MomentumIntegrals(1)));
        Assert.Equal("spectrum", error.ParamName);
    }

    [Fact]
    public void Result_of_the_wrong_size_or_shared_between_spectra_is_rejected()
    {
        var plan = new LoopQuadrature([0.1, 0.2]);
        var spectrum = new LogSampledSpectrum(InventedSpectra.Smooth);
        Assert.Equal("result", Assert.Throws<ArgumentException>(() => plan.Compute(spectrum, new MomentumIntegrals(3))).ParamName);
        var shared = new MomentumIntegrals(2);
        Assert.Equal("secondResult", Assert.Throws<ArgumentException>(() => plan.Compute(spectrum, spectrum, shared, shared)).ParamName);
    }
}
