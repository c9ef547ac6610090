using MathNet.Numerics.LinearAlgebra;
using Sibyl.Demo.Likelihood;
using Sibyl.Demo.Survey;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Demo.Tests.Likelihood;

/// <summary>
/// The analytic marginalisation against the marginal distribution written directly: integrating θ ~ N(μ, S) out of
/// d ~ N(m₀ + Aθ, C) leaves d ~ N(m₀ + Aμ, C + ASAᵀ) (a Gaussian linear model; e.g. Bishop 2006, Pattern Recognition and
/// Machine Learning, eq. 2.115). By the matrix determinant lemma det(C + ASAᵀ) = det C det S det F, so the code's
/// −2 ln L plus the constant it drops, ln det C + ln det S, must equal (r − Aμ)ᵀ(C + ASAᵀ)⁻¹(r − Aμ) + ln det(C + ASAᵀ).
/// </summary>
public sealed class MultipoleLikelihoodTests
{
    [Fact]
    public void Analytic_marginalisation_equals_the_gaussian_with_the_prior_folded_into_the_covariance()
    {
        const int nk = 6;
        double[] k = [.. Enumerable.Range(0, nk).Select(i => 0.05 + (0.02 * i))];

        // A toy basis: P0 = b1² T1(k) + c0 T2(k) + stoch0 · 1 (names of the galaxy layout, shapes invented for the test).
        var layout = new BasisLayout(
            ["P0"],
            ["b1", "c0", "stoch0"],
            [new BasisTerm("P0_b1b1", 0, 1.0, [0, 0]), new BasisTerm("P0_c0", 0, -2.0, [1]), new BasisTerm("P0_stoch0", 0, 1.0, [2])]);
        double[] terms = [.. k.Select(x => 1e4 / (1 + (10 * x))), .. k.Select(x => x * x * 1e4), .. k.Select(_ => 1.0)];
        var basis = new BasisSpectra(layout, k, terms);

        var random = new Random(4);
        var root = Matrix<double>.Build.Dense(nk, nk, (_, _) => random.NextDouble() - 0.5);
        var covariance = (root * root.Transpose()) + Matrix<double>.Build.DenseIdentity(nk);
        covariance *= 1e4;
        double[] values = [.. Enumerable.Range(0, nk).Select(i => (4.4 * terms[i]) + (100.0 * random.NextDouble()))];
        var data = new DataVector(k, [0], values, covariance.ToArray());
        var scenario = Scenario([new GaussianPrior("c0", 1.0, 5.0), new GaussianPrior("stoch0", -50.0, 300.0)]);

        var likelihood = new MultipoleLikelihood(data, layout, scenario);
        const double b1 = 2.1;
        double ours = likelihood.Evaluate(basis, [b1]).MinusTwoLnL;

        var m0 = Vector<double>.Build.DenseOfArray(likelihood.Model(basis, likelihood.Nuisance([b1], [0.0, 0.0])));
        var design = Matrix<double>.Build.DenseOfColumnArrays(
            [.. k.Select(x => -2.0 * x * x * 1e4)],
            [.. k.Select(_ => 1.0)]);
        var priorMean = Vector<double>.Build.DenseOfArray([1.0, -50.0]);
        var priorCovariance = Matrix<double>.Build.DenseOfDiagonalArray([25.0, 90000.0]);
        var total = covariance + (design * priorCovariance * design.Transpose());
        var residual = Vector<double>.Build.DenseOfArray(values) - m0 - (design * priorMean);
        double direct = residual.DotProduct(total.Cholesky().Solve(residual)) + total.Cholesky().DeterminantLn;
        double dropped = covariance.Cholesky().DeterminantLn + priorCovariance.Cholesky().DeterminantLn;

        // Two routes through dense linear algebra on well-conditioned 6×6 and 2×2 matrices; values are of order 10–100,
        // so 1e-8 absolute leaves a wide margin above rounding (about 1e-12 relative).
        Assert.Equal(direct, ours + dropped, 1e-8);
    }

    [Fact]
    public void A_parameter_entering_quadratically_cannot_be_marginalised()
    {
        var layout = new BasisLayout(["P0"], ["b1", "c0", "stoch0"], [new BasisTerm("P0_b1b1", 0, 1.0, [0, 0])]);
        var data = new DataVector([0.1], [0], [1.0], new double[,] { { 1.0 } });
        var scenario = Scenario([new GaussianPrior("b1", 0.0, 1.0)]) with { SampledNuisance = [] };
        Assert.Throws<ArgumentException>(() => new MultipoleLikelihood(data, layout, scenario));
    }

    private static SurveyScenario Scenario(GaussianPrior[] marginalised) => new()
    {
        Name = "test",
        Description = "invented for a unit test",
        Redshift = 0.5,
        Volume = 1e9,
        NumberDensity = 1e-3,
        KBins = new KBins(0.04, 0.16, 0.02),
        Multipoles = [0],
        HiddenCosmology = [],
        HiddenNuisance = new() { ["b1"] = 2.0, ["c0"] = 0.0, ["stoch0"] = 0.0 },
        SampledNuisance = [new SampledNuisance("b1", 1.0, 3.0, 2.0)],
        MarginalisedNuisance = marginalised,
        NoiseSeed = 1,
    };
}
