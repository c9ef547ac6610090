using Sibyl.Demo.Sampling;

namespace Sibyl.Demo.Tests.Sampling;

/// <summary>
/// The affine-invariant ensemble sampler (Goodman &amp; Weare 2010) against targets with known moments. Tolerances are
/// several Monte Carlo standard errors: with 32 walkers × 3000 kept steps and an autocorrelation time of a few tens of
/// steps for these targets (the paper's Gaussian examples), about 3000 effective samples remain, so the standard error
/// of a mean is about 0.02σ and of a variance about 0.03σ² (√(2/N_eff)); the chains are seeded, so the tests are
/// deterministic and the margins only guard against a seed that happens to be unlucky. The moment tests have power:
/// with the acceptance factor z^{d−1} replaced by z^d (a broken detailed balance) both of them fail.
/// </summary>
public sealed class EnsembleSamplerTests
{
    private const int Walkers = 32, Steps = 3500, BurnIn = 500;

    [Fact]
    public void Sampler_recovers_mean_and_covariance_of_a_correlated_two_dimensional_gaussian()
    {
        double[] mean = [1.0, -2.0], sigma = [1.0, 3.0];
        const double correlation = 0.8;
        var chain = new EnsembleSampler(seed: 11).Run(new GaussianDensity(mean, sigma, correlation), Start(2, 7), Steps);
        var samples = chain.Samples(BurnIn).ToList();

        for (int q = 0; q < 2; q++)
        {
            double m = samples.Average(s => s[q]);
            double variance = samples.Sum(s => (s[q] - m) * (s[q] - m)) / (samples.Count - 1);

            // 5 standard errors of the mean (0.02σ each, see the class comment).
            Assert.InRange(m, mean[q] - (0.1 * sigma[q]), mean[q] + (0.1 * sigma[q]));

            // 5 standard errors of the variance (0.03σ² each).
            Assert.InRange(variance / (sigma[q] * sigma[q]), 0.85, 1.15);
        }

        double m0 = samples.Average(s => s[0]), m1 = samples.Average(s => s[1]);
        double c01 = samples.Sum(s => (s[0] - m0) * (s[1] - m1)) / (samples.Count - 1);
        double s0 = Math.Sqrt(samples.Sum(s => (s[0] - m0) * (s[0] - m0)) / (samples.Count - 1));
        double s1 = Math.Sqrt(samples.Sum(s => (s[1] - m1) * (s[1] - m1)) / (samples.Count - 1));

        // The standard error of a correlation coefficient is (1 − ρ²)/√N_eff ≈ 0.007 here; 0.04 is over 5 of them.
        Assert.InRange(c01 / (s0 * s1), correlation - 0.04, correlation + 0.04);
    }

    [Fact]
    public void Stretch_move_keeps_detailed_balance_so_a_one_dimensional_normal_keeps_unit_variance()
    {
        // In one dimension the acceptance factor z^{d−1} is 1; a move that broke detailed balance (a wrong z density or
        // factor) would bias the variance, which a symmetric target leaves as the sharpest check.
        var chain = new EnsembleSampler(seed: 5).Run(new GaussianDensity([0.0], [1.0], 0.0), Start(1, 3), Steps);
        var samples = chain.Samples(BurnIn).Select(s => s[0]).ToList();
        double m = samples.Average();
        double variance = samples.Sum(v => (v - m) * (v - m)) / (samples.Count - 1);
        Assert.InRange(m, -0.1, 0.1);
        Assert.InRange(variance, 0.9, 1.1);

        // The fourth moment of a normal is 3σ⁴; its standard error is about √(96/N_eff) ≈ 0.2 at N_eff ≈ 3000.
        double kurtosis = samples.Average(v => Math.Pow(v - m, 4)) / (variance * variance);
        Assert.InRange(kurtosis, 2.5, 3.5);
    }

    [Fact]
    public void Proposals_outside_the_support_are_rejected_so_every_walker_stays_in_the_box()
    {
        var density = new GaussianDensity([0.0, 0.0], [1.0, 1.0], 0.0, boxMin: [-0.5, 0.0], boxMax: [0.5, 2.0]);
        var chain = new EnsembleSampler(seed: 3).Run(density, Start(2, 1, scale: 0.1, centre: 0.5), 300);
        foreach (var s in chain.Samples(0))
        {
            Assert.InRange(s[0], -0.5, 0.5);
            Assert.InRange(s[1], 0.0, 2.0);
        }
    }

    [Fact]
    public void Same_seed_and_start_give_the_same_chain()
    {
        var density = new GaussianDensity([0.0, 0.0], [1.0, 1.0], 0.5);
        var first = new EnsembleSampler(seed: 9).Run(density, Start(2, 2), 50);
        var second = new EnsembleSampler(seed: 9).Run(density, Start(2, 2), 50);
        Assert.Equal(first.Samples(0).SelectMany(s => s), second.Samples(0).SelectMany(s => s));
    }

    /// <summary>Walkers in a small ball (so the burn-in must spread them out to the target's width).</summary>
    private static double[][] Start(int dimension, int seed, double scale = 0.01, double centre = 0.0)
    {
        var random = new Random(seed);
        return [.. Enumerable.Range(0, Walkers).Select(_ => Enumerable.Range(0, dimension).Select(q => (q == 1 ? centre : 0.0) + (scale * (random.NextDouble() - 0.5))).ToArray())];
    }
}
