using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

public sealed class P13KernelTests
{
    [Theory]
    [InlineData(0.01)]
    [InlineData(0.1)]
    [InlineData(0.5)]
    [InlineData(0.99)]
    [InlineData(1.0)]
    [InlineData(1.01)]
    [InlineData(2.0)]
    [InlineData(10.0)]
    [InlineData(100.0)]
    [InlineData(1e4)]
    public void EdS_combination_of_P13_kernels_is_the_standard_reduced_kernel(double r)
    {
        // Bernardeau et al. 2002, Phys. Rep. 367, 1 (from memory; verified here against the structures pointwise):
        // 1008 r² Σ X_s K_s(r) = B(r). Tolerance 1e-10 relative (brief): both sides are evaluated to ~1e-13.
        Span<double> kernels = stackalloc double[6];
        P13Kernels.Evaluate(r, kernels);
        double combination = 0.0;
        for (int s = 0; s < 6; s++)
        {
            combination += DefinitionStructures.EdsP13Coefficients[s] * kernels[s];
        }

        double expected = ReducedP13Kernel.Evaluate(r);
        Assert.Equal(expected, 1008.0 * r * r * combination, Math.Abs(expected) * 1e-10);
    }

    [Fact]
    public void Reduced_kernel_series_cancel_the_closed_forms_singular_terms()
    {
        // The closed form's 12/r² (small r) and −42r⁴ + 100r² (large r) must cancel exactly in the series,
        // and the limits are B(0) = −168 and B(∞) = −488/5 (the latter gives −(61/105)k²σ_v²P). Exact rationals, so 1e-12.
        Assert.Equal(0.0, ReducedP13Kernel.SmallCoefficient(-1), 1e-12);
        Assert.Equal(0.0, ReducedP13Kernel.LargeCoefficient(2), 1e-12);
        Assert.Equal(0.0, ReducedP13Kernel.LargeCoefficient(1), 1e-12);
        Assert.Equal(-168.0, ReducedP13Kernel.SmallCoefficient(0), 1e-12);
        Assert.Equal(-488.0 / 5.0, ReducedP13Kernel.LargeCoefficient(0), 1e-12);
        // The series and closed form agree where both are well conditioned (loss ≲ 1e3 ulp there).
        foreach (double r in new[] { 0.2, 5.0 })
        {
            double series = r < 1 ? ReducedSeriesAt(r, small: true) : ReducedSeriesAt(r, small: false);
            Assert.Equal(ReducedP13Kernel.ClosedForm(r), series, 1e-10 * Math.Abs(series));
        }
    }

    [Theory]
    [InlineData(0.03)]
    [InlineData(0.3)]
    [InlineData(0.7)]
    [InlineData(0.97)]
    [InlineData(0.9999)]
    [InlineData(1.0)]
    [InlineData(1.0 + 1e-9)]
    [InlineData(1.03)]
    [InlineData(1.6)]
    [InlineData(4.0)]
    [InlineData(40.0)]
    public void Each_P13_kernel_is_the_angular_integral_of_its_definition(double r)
    {
        // Referee: M_s(x, r) taken literally from the definitions, integrated by MathNet Gauss–Legendre in x
        // (|1 − r| > 0.3) or in t = ln p² near the pole (see BruteForceReferee.Kernel). Tolerance 1e-9 of the
        // largest kernel: the literal form loses up to r² (≈ 1.6e3 at r = 40) to cancellation between aA and aB.
        Span<double> kernels = stackalloc double[6];
        P13Kernels.Evaluate(r, kernels);
        double scale = 0.0;
        for (int s = 0; s < 6; s++)
        {
            scale = Math.Max(scale, Math.Abs(kernels[s]));
        }

        for (int s = 0; s < 6; s++)
        {
            double referee = BruteForceReferee.Kernel(s, r);
            Assert.True(
                Math.Abs(referee - kernels[s]) <= 1e-9 * scale,
                $"structure {(P13Structure)s} at r = {r}: kernel {kernels[s]:R}, referee {referee:R}");
        }
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void P13_kernel_series_join_the_closed_form_at_the_switch_points(double r)
    {
        // The series regime ends exactly at r = 1/2 and 2; there the closed form is still well conditioned
        // (x0 = 1.25), so both must agree to rounding: 1e-13 relative to the largest kernel.
        Span<double> series = stackalloc double[6];
        Span<double> closed = stackalloc double[6];
        P13Kernels.Evaluate(r, series);
        P13Kernels.EvaluateClosedForm(r, closed);
        double scale = 0.0;
        for (int s = 0; s < 6; s++)
        {
            scale = Math.Max(scale, Math.Abs(series[s]));
        }

        for (int s = 0; s < 6; s++)
        {
            Assert.True(Math.Abs(series[s] - closed[s]) <= 1e-13 * scale, $"{(P13Structure)s}: {series[s]:R} vs {closed[s]:R}");
        }
    }

    private static double ReducedSeriesAt(double r, bool small)
    {
        double sum = 0.0;
        if (small)
        {
            for (int t = 60; t >= 0; t--)
            {
                sum = (sum * r * r) + ReducedP13Kernel.SmallCoefficient(t);
            }

            return sum;
        }

        for (int t = -60; t <= 0; t++)
        {
            sum = (sum / (r * r)) + ReducedP13Kernel.LargeCoefficient(t);
        }

        return sum;
    }
}
