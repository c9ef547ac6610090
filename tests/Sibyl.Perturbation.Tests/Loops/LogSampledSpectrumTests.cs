using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

public sealed class LogSampledSpectrumTests
{
    [Fact]
    public void Interpolated_spectrum_reproduces_a_smooth_spectrum_between_nodes()
    {
        // Cubic Lagrange in ln q: error ≈ (3/128) h⁴ |∂⁴P/∂(ln q)⁴| with h ≈ 0.0079; for the invented smooth
        // spectrum (|slope| ≤ 3.04, gentle curvature) that is ≲ 1e-8, so 1e-7 relative leaves a 10× margin.
        var table = new LogSampledSpectrum(InventedSpectra.Smooth);
        for (double q = 1.3e-5; q < 99.0; q *= 1.0123)
        {
            double exact = InventedSpectra.Smooth(q);
            Assert.Equal(exact, table.Evaluate(q), exact * 1e-7);
        }
    }

    [Fact]
    public void Interpolated_spectrum_resolves_baryon_wiggles()
    {
        // 5 % wiggles of period 0.06 h/Mpc: error ≲ (3/128)(105 q h)⁴·0.05 ≈ 1e-5 of P at q = 0.5; tolerance 3e-5.
        var table = new LogSampledSpectrum(InventedSpectra.Wiggly);
        for (double q = 0.01; q < 0.8; q += 0.0013)
        {
            double exact = InventedSpectra.Wiggly(q);
            Assert.Equal(exact, table.Evaluate(q), exact * 3e-5);
        }
    }

    [Fact]
    public void Spectrum_is_exact_at_nodes_and_zero_outside_the_table()
    {
        var table = new LogSampledSpectrum(InventedSpectra.Smooth, 1e-4, 10.0, 64);
        for (int i = 0; i < table.Count; i++)
        {
            // At a node the Lagrange weights are 1 and 0 up to rounding of ln q: 1e-13 relative.
            Assert.Equal(table.Values[i], table.Evaluate(table.NodeQ(i)), Math.Abs(table.Values[i]) * 1e-13);
        }

        Assert.Equal(0.0, table.Evaluate(0.99e-4));
        Assert.Equal(0.0, table.Evaluate(10.01));
        Assert.Equal(0.0, table.Evaluate(double.NaN));
    }

    [Fact]
    public void Raw_values_and_sampled_function_build_the_same_table()
    {
        var sampled = new LogSampledSpectrum(InventedSpectra.Wiggly, 1e-3, 1.0, 100);
        var raw = new LogSampledSpectrum(sampled.Values, 1e-3, 1.0);
        Assert.Equal(sampled.Values.ToArray(), raw.Values.ToArray());
        Assert.Equal(sampled.Evaluate(0.0123), raw.Evaluate(0.0123));
    }

    [Theory]
    [InlineData(0.0, 1.0, 16, "qMin")]
    [InlineData(-1.0, 1.0, 16, "qMin")]
    [InlineData(double.NaN, 1.0, 16, "qMin")]
    [InlineData(1.0, 1.0, 16, "qMax")]
    [InlineData(1e-3, double.PositiveInfinity, 16, "qMax")]
    [InlineData(1e-3, 1.0, 3, "count")]
    public void Invalid_table_geometry_is_rejected_by_name(double qMin, double qMax, int count, string parameter)
    {
        var error = Assert.Throws<ArgumentException>(() => new LogSampledSpectrum(q => 1.0, qMin, qMax, count));
        Assert.Equal(parameter, error.ParamName);
    }

    [Fact]
    public void Non_finite_spectrum_values_are_rejected_with_the_offending_value()
    {
        var error = Assert.Throws<ArgumentException>(() => new LogSampledSpectrum(q => q > 1.0 ? double.NaN : 1.0));
        Assert.Contains("NaN", error.Message, StringComparison.Ordinal);
        double[] values = [1.0, 2.0, double.PositiveInfinity, 3.0];
        error = Assert.Throws<ArgumentException>(() => new LogSampledSpectrum(values, 1e-3, 1.0));
        Assert.Contains("values[2]", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Table_truncation_changes_the_loop_integrals_negligibly()
    {
        // Documented claim: cutting the invented ΛCDM-like spectrum to 1e-5…100 h/Mpc changes every integral by
        // ≤ 2e-5 (measured against 1e-8…1e4 h/Mpc, the difference including the two plans' quadrature).
        // Tolerance 1e-4 keeps the claim honest while leaving room for the quadrature part.
        double[] k = [0.005, 0.5, 1.0];
        var standard = new LogSampledSpectrum(InventedSpectra.Wiggly);
        var wide = new LogSampledSpectrum(InventedSpectra.Wiggly, 1e-8, 1e4, 3600);
        var standardResult = new MomentumIntegrals(k.Length);
        var wideResult = new MomentumIntegrals(k.Length);
        new LoopQuadrature(k).Compute(standard, standardResult);
        new LoopQuadrature(k, 1e-8, 1e4).Compute(wide, wideResult);
        for (int i = 0; i < k.Length; i++)
        {
            for (int s = 0; s < 6; s++)
            {
                double reference = wideResult[(P13Structure)s][i];
                Assert.Equal(reference, standardResult[(P13Structure)s][i], Math.Abs(reference) * 1e-4);
            }

            for (int s = 0; s < 3; s++)
            {
                double reference = wideResult[(P22Structure)s][i];
                Assert.Equal(reference, standardResult[(P22Structure)s][i], Math.Abs(reference) * 1e-4);
            }
        }
    }
}
