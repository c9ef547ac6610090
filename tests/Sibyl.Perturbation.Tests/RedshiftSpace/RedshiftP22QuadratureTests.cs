using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.RedshiftSpace;
using Xunit.Abstractions;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>The redshift-space P_22 plan against the real-space plan and against the brute-force vector referee.</summary>
public sealed class RedshiftP22QuadratureTests(ITestOutputHelper output)
{
    private static readonly double[] RefereeK = [0.02, 0.1, 0.25];
    private static readonly double[] RefereeMu = [0.2, 0.6, 0.95];

    private static readonly LogSampledSpectrum Spectrum = new(InventedWigglySpectrum.Evaluate);
    private static readonly Lazy<(RedshiftP22Quadrature Plan, RedshiftP22Integrals Result)> Computed = new(() =>
    {
        var plan = new RedshiftP22Quadrature(RefereeK);
        var result = new RedshiftP22Integrals(plan.KCount);
        plan.Compute(Spectrum, result);
        return (plan, result);
    });

    [Fact]
    public void Mu_independent_products_reduce_to_the_real_space_integrals()
    {
        // Same definitions J_S = 2∫d³q/(2π)³ S P P for S = α_s², α_sγ, γ² (LoopQuadrature's), same grid and rules:
        // only rounding differs. Tolerance 1e-10 relative (the brief's).
        double[] k = [0.01, 0.03, 0.07, 0.15, 0.3];
        var plan = new RedshiftP22Quadrature(k);
        var result = new RedshiftP22Integrals(k.Length);
        plan.Compute(Spectrum, result);
        var realPlan = new LoopQuadrature(k);
        var real = new MomentumIntegrals(k.Length);
        realPlan.Compute(Spectrum, real);
        (RedshiftP22Structure, RedshiftP22Structure, P22Structure)[] pairs =
        [
            (RedshiftP22Structure.AlphaS, RedshiftP22Structure.AlphaS, P22Structure.AlphaAlpha),
            (RedshiftP22Structure.AlphaS, RedshiftP22Structure.Gamma, P22Structure.AlphaGamma),
            (RedshiftP22Structure.Gamma, RedshiftP22Structure.Gamma, P22Structure.GammaGamma),
        ];
        foreach ((var a, var b, var s) in pairs)
        {
            for (int i = 0; i < k.Length; i++)
            {
                double expected = real[s][i];
                double actual = result.Get(a, b, 0)[i];
                Assert.True(Math.Abs(actual - expected) <= 1e-10 * Math.Abs(expected), $"{s} at k = {k[i]:R}: {actual:R} vs {expected:R}");
            }
        }
    }

    [Theory]
    [InlineData(RedshiftP22Structure.AlphaS, RedshiftP22Structure.L1, 0)]
    [InlineData(RedshiftP22Structure.L1, RedshiftP22Structure.L1, 1)]
    [InlineData(RedshiftP22Structure.L1, RedshiftP22Structure.L2, 2)]
    [InlineData(RedshiftP22Structure.L2, RedshiftP22Structure.L2, 0)]
    [InlineData(RedshiftP22Structure.Gamma, RedshiftP22Structure.Mu2Gamma, 1)]
    [InlineData(RedshiftP22Structure.One, RedshiftP22Structure.One, 2)]
    [InlineData(RedshiftP22Structure.AlphaS, RedshiftP22Structure.One, 0)]
    public void Mu_polynomial_of_the_plan_matches_the_three_dimensional_referee(RedshiftP22Structure a, RedshiftP22Structure b, int rotation)
    {
        // Σ_n J_{ab,n}(k) μ^{2n} against the full-domain vector referee (independent of the φ-averaged decomposition)
        // at each k of (0.02, 0.1, 0.25) h/Mpc, with μ of (0.2, 0.6, 0.95) rotated per pair so that the seven pairs
        // cover all nine (k, μ) combinations while each referee integral (~1 s in Debug) is done only three times.
        // Tolerance 1e-3 relative (the brief's): the referee is good to ~1e-6, the plan's quadrature to ~1e-5, and
        // the plan's resampled table differs from the analytic P by ≲ 1e-5.
        (var plan, var result) = Computed.Value;
        var referee = new RedshiftBruteForceReferee(InventedWigglySpectrum.Evaluate, Spectrum.QMin, Spectrum.QMax);
        for (int i = 0; i < plan.KCount; i++)
        {
            double mu = RefereeMu[(i + rotation) % RefereeMu.Length];
            double polynomial = 0.0;
            for (int n = RedshiftP22Layout.PowerCount - 1; n >= 0; n--)
            {
                polynomial = (polynomial * mu * mu) + result.Get(a, b, n)[i];
            }

            double expected = referee.Integral(a, b, plan.K[i], mu);
            double error = Math.Abs((polynomial / expected) - 1.0);
            output.WriteLine($"({a}, {b}) k = {plan.K[i]:R} μ = {mu:R}: plan {polynomial:R}, referee {expected:R}, relative {error:E2}");
            Assert.True(error <= 1e-3, $"({a}, {b}) at k = {plan.K[i]:R}, μ = {mu:R}: {polynomial:R} vs referee {expected:R}.");
        }
    }

    [Fact]
    public void Two_spectra_in_one_pass_give_the_single_spectrum_results()
    {
        // Same weights, same sums in the same order: identical to rounding (1e-14 relative).
        (var plan, var single) = Computed.Value;
        var smooth = new LogSampledSpectrum(InventedWigglySpectrum.Smooth);
        var first = new RedshiftP22Integrals(plan.KCount);
        var second = new RedshiftP22Integrals(plan.KCount);
        var smoothSingle = new RedshiftP22Integrals(plan.KCount);
        plan.Compute(Spectrum, smooth, first, second);
        plan.Compute(smooth, smoothSingle);
        foreach (var a in Enum.GetValues<RedshiftP22Structure>())
        {
            foreach (var b in Enum.GetValues<RedshiftP22Structure>())
            {
                for (int n = 0; n < RedshiftP22Layout.PowerCount; n++)
                {
                    for (int i = 0; i < plan.KCount; i++)
                    {
                        Assert.Equal(single.Get(a, b, n)[i], first.Get(a, b, n)[i], 1e-14 * Math.Abs(single.Get(a, b, n)[i]));
                        Assert.Equal(smoothSingle.Get(a, b, n)[i], second.Get(a, b, n)[i], 1e-14 * Math.Abs(smoothSingle.Get(a, b, n)[i]));
                    }
                }
            }
        }
    }

    [Fact]
    public void Invalid_wavenumbers_ranges_and_results_are_rejected()
    {
        Assert.Throws<ArgumentException>(() => new RedshiftP22Quadrature([]));
        Assert.Throws<ArgumentException>(() => new RedshiftP22Quadrature([0.1, 0.05]));
        Assert.Throws<ArgumentException>(() => new RedshiftP22Quadrature([20.0]));
        Assert.Throws<ArgumentException>(() => new RedshiftP22Quadrature([0.1], qMin: -1.0));
        (var plan, _) = Computed.Value;
        Assert.Throws<ArgumentException>(() => plan.Compute(Spectrum, new RedshiftP22Integrals(plan.KCount + 1)));
        var result = new RedshiftP22Integrals(plan.KCount);
        Assert.Throws<ArgumentException>(() => plan.Compute(Spectrum, Spectrum, result, result));
        Assert.Throws<ArgumentException>(() => plan.Compute(new LogSampledSpectrum(InventedWigglySpectrum.Evaluate, 1e-4, 100.0), result));
    }
}
