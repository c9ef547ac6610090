using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

public class OneLoopGalaxyTests
{
    private const double Z = 1.0;
    private static readonly double[] K = LogGridFunction.LogGrid(0.01, 0.3, 24);
    private static readonly CosmologyModel Planck = CosmologyModel.Create(new CosmologyParameters());
    private static readonly OneLoopGalaxy Galaxy = new(K);
    private static readonly PreparedGalaxyShape Prepared = Galaxy.Prepare(Planck.Linear);
    private static readonly TimeCoefficients Time = TimeCoefficientSolver.Solve(Planck.Background, Planck.Gravity, 1.0 / (1.0 + Z));

    [Fact]
    public void Tree_level_multipoles_are_Kaiser()
    {
        // Kaiser (1987, MNRAS 227, 1): P0 = (b² + 2bf/3 + f²/5)P, P2 = (4bf/3 + 4f²/7)P, P4 = 8f²/35 P.
        // A spectrum without wiggles makes the IR damping inert; (b + fμ²)² L4(μ) is a polynomial of degree 8,
        // integrated exactly by the μ rule (16 Gauss–Legendre nodes are exact to degree 31), so the only error
        // is the rounding of ~50 weighted sums: 1e-10 relative (the issue asks 1e-6).
        var smooth = Galaxy.Prepare(Planck.Linear with { Shape = Planck.Linear.NoWiggleShape });
        var spectrum = Galaxy.Evaluate(smooth, Time, includeLoops: false);
        double b = 1.8, f = Time.F;
        var nuisance = Nuisance(b1: b);

        var p0 = spectrum.Multipole(0, nuisance);
        var p2 = spectrum.Multipole(2, nuisance);
        var p4 = spectrum.Multipole(4, nuisance);

        for (int i = 0; i < K.Length; i++)
        {
            double p = spectrum.NoWiggle[i];
            Assert.Equal((b * b + 2 * b * f / 3 + f * f / 5) * p, p0[i], p * 1e-10);
            Assert.Equal((4 * b * f / 3 + 4 * f * f / 7) * p, p2[i], p * 1e-10);
            Assert.Equal(8 * f * f / 35 * p, p4[i], p * 1e-10);
        }
    }

    [Fact]
    public void Real_space_limit_with_unit_bias_is_the_one_loop_matter_spectrum()
    {
        // Mapping off (f → 0 in the mapping), b1 = 1, other biases 0: P0 equals the IR-resummed one-loop
        // matter spectrum of OneLoopMatter, loop included, and P2 = P4 = 0. Two independent P22 plans agree
        // to ~1e-10 and the μ integral of a constant is exact: 1e-8.
        var galaxy = Galaxy.Evaluate(Prepared, Time, mappingScale: 0.0);
        var matter = new OneLoopMatter(K).Compute(Planck, Z).Total(0.0);
        var nuisance = Nuisance(b1: 1.0);

        var p0 = galaxy.Multipole(0, nuisance);
        var p2 = galaxy.Multipole(2, nuisance);

        for (int i = 0; i < K.Length; i++)
        {
            Assert.Equal(1.0, p0[i] / matter[i], 1e-8);
            Assert.Equal(0.0, p2[i] / matter[i], 1e-10);
        }
    }

    [Fact]
    public void Counterterm_columns_have_their_closed_form_mu_integrals()
    {
        // On a spectrum without wiggles P_IR = P_nw, so (2ℓ+1)∫_0^1 μ^{2n} L_ℓ dμ gives each column exactly:
        // μ² → (1/3, 2/3, 0) and μ⁴ → (1/5, 4/7, 8/35) for ℓ = 0, 2, 4 (Legendre moments, Abramowitz &
        // Stegun 22.13). The layout holds the prefactors −2 and −1; the columns are the positive shapes.
        var smooth = Galaxy.Prepare(Planck.Linear with { Shape = Planck.Linear.NoWiggleShape });
        var spectrum = Galaxy.Evaluate(smooth, Time);
        double f = Time.F;
        for (int i = 0; i < K.Length; i++)
        {
            double k2p = K[i] * K[i] * spectrum.NoWiggle[i], fog = Math.Pow(f, 4) * K[i] * K[i] * k2p;
            Assert.Equal(k2p, spectrum.Basis.Term("P0_c0")[i], k2p * 1e-12);
            Assert.Equal(0.0, spectrum.Basis.Term("P2_c0")[i], k2p * 1e-12);
            Assert.Equal(f * k2p / 3, spectrum.Basis.Term("P0_c2")[i], k2p * 1e-12);
            Assert.Equal(2 * f * k2p / 3, spectrum.Basis.Term("P2_c2")[i], k2p * 1e-12);
            Assert.Equal(fog / 5, spectrum.Basis.Term("P0_ck4_b1b1")[i], fog * 1e-12);
            Assert.Equal(4 * fog / 7, spectrum.Basis.Term("P2_ck4_b1b1")[i], fog * 1e-12);
            Assert.Equal(8 * fog / 35, spectrum.Basis.Term("P4_ck4_b1b1")[i], fog * 1e-12);
        }
    }

    [Fact]
    public void Multipoles_are_exactly_polynomial_in_the_nuisance_parameters()
    {
        // Property test (random values, fixed seed): P_ell is linear in counterterms and stochastic terms
        // and quadratic in each bias, so second differences in b1 are constant and third vanish; linear
        // superposition holds for c0 + c2. Rounding only: 1e-9 relative to |P|.
        var spectrum = Galaxy.Evaluate(Prepared, Time);
        var random = new Random(20261202);
        for (int trial = 0; trial < 5; trial++)
        {
            var theta = GalaxyLayout.Nuisance.Select(_ => random.NextDouble() * 2 - 1).ToArray();
            theta[0] = 1 + random.NextDouble();
            foreach (int ell in GalaxyLayout.Multipoles)
            {
                double[] At(int index, double value)
                {
                    var t = (double[])theta.Clone();
                    t[index] = value;
                    return spectrum.Multipole(ell, t);
                }

                double b = theta[0], h = 0.3;
                var m1 = At(0, b - h); var p0 = At(0, b); var p1 = At(0, b + h); var p2 = At(0, b + 2 * h);
                var c0 = At(4, 0.0); var c1 = At(4, 1.0); var c3 = At(4, 3.0);
                for (int i = 0; i < K.Length; i++)
                {
                    double scale = Math.Abs(p0[i]) + Math.Abs(p1[i]);
                    Assert.Equal(0.0, p2[i] - 3 * p1[i] + 3 * p0[i] - m1[i], scale * 1e-9);
                    Assert.Equal(c0[i] + 3 * (c1[i] - c0[i]), c3[i], scale * 1e-9);
                }
            }
        }
    }

    [Fact]
    public void Hexadecapole_wiggles_are_damped_more_than_the_monopole()
    {
        // Σ²_tot(μ) grows with μ (Ivanov & Sibiryakov 2018), and P4 weighs high μ most, so after resummation
        // P4 keeps a smaller fraction of its linear wiggle than P0 (common practice). Tree level isolates it.
        var smooth = Galaxy.Prepare(Planck.Linear with { Shape = Planck.Linear.NoWiggleShape });
        var withWiggles = Galaxy.Evaluate(Prepared, Time, includeLoops: false);
        var without = Galaxy.Evaluate(smooth, Time, includeLoops: false);
        var nuisance = Nuisance(b1: 1.5);
        double f = Time.F, b = 1.5;
        double[] kaiser = [b * b + 2 * b * f / 3 + f * f / 5, 0, 8 * f * f / 35];

        double Retained(int ell, int slot)
        {
            var a = withWiggles.Multipole(ell, nuisance);
            var c = without.Multipole(ell, nuisance);
            double resummed = 0, linear = 0;
            for (int i = 0; i < K.Length; i++)
            {
                if (K[i] > 0.1)
                {
                    resummed += Math.Abs(a[i] - c[i]);
                    linear += Math.Abs(kaiser[slot] * (withWiggles.Linear[i] - withWiggles.NoWiggle[i]));
                }
            }

            return resummed / linear;
        }

        Assert.True(Retained(4, 2) < Retained(0, 0), $"P4 keeps {Retained(4, 2)}, P0 keeps {Retained(0, 0)}");
    }

    [Fact]
    public void Sixteen_mu_nodes_reach_the_multipole_integrals_to_1e5()
    {
        // The issue asks for 1e-5 on the multipole integrals; compare with a 64-node rule at z = 0 up to
        // k = 0.5 h/Mpc, where the damping is steepest. Measured relative to |P0|.
        double[] k = LogGridFunction.LogGrid(0.1, 0.5, 6);
        var fine = new OneLoopGalaxy(k, 64);
        var standard = new OneLoopGalaxy(k);
        var time0 = TimeCoefficientSolver.Solve(Planck.Background, Planck.Gravity, 1.0);
        var coarse = standard.Evaluate(standard.Prepare(Planck.Linear), time0);
        var reference = fine.Evaluate(fine.Prepare(Planck.Linear), time0);
        var nuisance = Nuisance(b1: 2.0);
        var scale = reference.Multipole(0, nuisance);
        foreach (int ell in GalaxyLayout.Multipoles)
        {
            var a = coarse.Multipole(ell, nuisance);
            var r = reference.Multipole(ell, nuisance);
            for (int i = 0; i < k.Length; i++)
            {
                Assert.Equal(r[i], a[i], Math.Abs(scale[i]) * 1e-5);
            }
        }
    }

    private static double[] Nuisance(double b1)
    {
        var values = GalaxyLayout.Nuisance.Select(_ => 0.0).ToArray();
        values[0] = b1;
        return values;
    }
}
