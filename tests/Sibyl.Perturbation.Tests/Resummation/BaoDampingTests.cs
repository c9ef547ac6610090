using MathNet.Numerics.Integration;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Resummation;

namespace Sibyl.Perturbation.Tests.Resummation;

public class BaoDampingTests
{
    private static readonly CosmologyModel Planck = CosmologyModel.Create(new CosmologyParameters());

    [Fact]
    public void Sigma2_matches_adaptive_integration_of_its_definition()
    {
        // Independent referee: MathNet's adaptive Gauss–Kronrod on the same integral in ln q
        // (Blas et al. 2016, JCAP 07, 028, eq. for Σ²) to 1e-9; the fixed rules must agree to 1e-6.
        var nw = Planck.Linear.NoWiggleShape;
        double l = Planck.Linear.BaoScale;
        double referee = Adaptive(q => nw.Evaluate(q) * (1.0 - BaoDamping.SphericalBessel0(q * l) + 2.0 * BaoDamping.SphericalBessel2(q * l)))
                         / (6.0 * Math.PI * Math.PI);
        double deltaReferee = Adaptive(q => nw.Evaluate(q) * BaoDamping.SphericalBessel2(q * l)) / (2.0 * Math.PI * Math.PI);

        Assert.Equal(1.0, BaoDamping.Sigma2(nw, l) / referee, 1e-6);
        Assert.Equal(1.0, BaoDamping.DeltaSigma2(nw, l) / deltaReferee, 1e-6);
    }

    [Fact]
    public void Sigma2_tends_to_the_displacement_variance_for_a_very_long_bao_scale()
    {
        // ℓ → ∞: j0, j2 → 0 except at q ≲ 1/ℓ, so Σ² → (1/6π²)∫_0^{k_S} P_nw dq, the one-dimensional
        // displacement variance of the long modes. At ℓ = 1e5 Mpc/h the excluded region q < 1e-5 carries
        // nothing: 1e-3.
        var nw = Planck.Linear.NoWiggleShape;
        double variance = Adaptive(nw.Evaluate) / (6.0 * Math.PI * Math.PI);

        Assert.Equal(1.0, BaoDamping.Sigma2(nw, 1e5) / variance, 1e-3);
    }

    [Fact]
    public void Sigma_is_a_few_Mpc_per_h_for_a_Planck_like_cosmology_today()
    {
        // Common practice (e.g. Baldauf et al. 2015, PRD 92, 043514, fig. 2; from memory): the BAO damping
        // scale Σ is about 5–7 Mpc/h at z = 0 for Planck-like ΛCDM with k_S ≈ 0.2 h/Mpc.
        double d = Planck.Growth(0.0).D;
        double sigma = Math.Sqrt(d * d * BaoDamping.Sigma2(Planck.Linear.NoWiggleShape, Planck.Linear.BaoScale));

        Assert.InRange(sigma, 5.0, 7.5);
    }

    [Theory]
    [InlineData(1e-3)]
    [InlineData(0.5)]
    [InlineData(3.0)]
    [InlineData(20.0)]
    public void Spherical_Bessel_functions_match_their_closed_forms(double x)
    {
        // Abramowitz & Stegun 10.1.11–12: j0 = sin x/x, j2 = (3/x³ − 1/x) sin x − 3 cos x/x²; series below 1e-2.
        double j2 = x < 1e-2 ? x * x / 15.0 : (3.0 / (x * x * x) - 1.0 / x) * Math.Sin(x) - 3.0 * Math.Cos(x) / (x * x);

        Assert.Equal(Math.Sin(x) / x, BaoDamping.SphericalBessel0(x), 1e-12);
        Assert.Equal(j2, BaoDamping.SphericalBessel2(x), 1e-12);
    }

    private static double Adaptive(Func<double, double> integrand) =>
        GaussKronrodRule.Integrate(
            u => { double q = Math.Exp(u); return q * integrand(q); },
            Math.Log(Planck.Linear.NoWiggleShape.KMin), Math.Log(BaoDamping.SeparationScale), out _, out _, 1e-9, 12, 31);
}
