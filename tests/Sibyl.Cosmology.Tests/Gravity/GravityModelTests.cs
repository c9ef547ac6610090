using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Growth;

namespace Sibyl.Cosmology.Tests.Gravity;

public class GravityModelTests
{
    private static readonly ExpansionHistory Lcdm = new(0.31);

    [Fact]
    public void Ndgp_mu_tends_to_one_as_Omega_rc_vanishes()
    {
        // μ − 1 = 1/(3β) and β ≈ E/√Ω_rc · (1 + Ḣ/3H²) for small Ω_rc (Koyama, Taruya & Hiramatsu 2009),
        // so μ − 1 shrinks like √Ω_rc; at Ω_rc = 1e-8 it must be below 1e-3.
        foreach (double a in new[] { 0.3, 0.6, 1.0 })
        {
            Assert.Equal(1.0, new NormalBranchDgp(Lcdm, 1e-8).Mu(a), 1e-3);
            Assert.Equal(1.0, new NormalBranchDgp(Lcdm, 0.0).Mu(a), 0.0);
        }
    }

    [Fact]
    public void Ndgp_growth_is_enhanced_and_monotonic_in_Omega_rc()
    {
        // nDGP adds a fifth force (μ > 1 on the normal branch, β > 0), so growth rises with Ω_rc.
        double previous = LinearGrowth.Solve(Lcdm, GeneralRelativity.Instance, 1.0).D;
        foreach (double omegaRc in new[] { 0.01, 0.05, 0.1, 0.25, 0.5, 1.0 })
        {
            double d = LinearGrowth.Solve(Lcdm, new NormalBranchDgp(Lcdm, omegaRc), 1.0).D;
            Assert.True(d > previous, $"D(Omega_rc = {omegaRc}) = {d} must exceed {previous}");
            previous = d;
        }
    }

    [Fact]
    public void Ndgp_beta_matches_its_definition_in_matter_domination()
    {
        // Early on Ḣ/H² = −3/2, so β = 1 + E/(2√Ω_rc) (from the definition in KTH09).
        const double a = 1e-3, omegaRc = 0.25;
        double expected = 1.0 + Lcdm.Hubble(a) / (2.0 * Math.Sqrt(omegaRc));

        Assert.Equal(1.0, new NormalBranchDgp(Lcdm, omegaRc).Beta(a) / expected, 1e-6);
    }

    [Fact]
    public void Quasi_static_model_scales_with_dark_energy_and_vanishes_early()
    {
        // The documented time dependence (DEVELOPERS.md, "Gravity models"): amplitudes ∝ Ω_DE(a)/Ω_DE, so today
        // they equal their inputs to rounding (1e-14), and at a = 1e-3 Ω_DE(a)/Ω_DE ≈ 1e-9 · Ω_m⁻¹ leaves μ = 1 to 1e-8.
        var qs = new QuasiStaticModification(Lcdm, 0.2, -0.05, 0.01);

        Assert.Equal(1.2, qs.Mu(1.0), 1e-14);
        Assert.Equal(-0.05, qs.QuadraticVertex(1.0), 1e-14);
        Assert.Equal(0.01, qs.CubicVertex(1.0), 1e-14);
        Assert.Equal(1.0, qs.Mu(1e-3), 1e-8);
    }

    [Fact]
    public void Quasi_static_model_with_zero_amplitudes_is_general_relativity()
    {
        var qs = new QuasiStaticModification(Lcdm, 0.0, 0.0, 0.0);
        double dQs = LinearGrowth.Solve(Lcdm, qs, 0.5).D;
        double dGr = LinearGrowth.Solve(Lcdm, GeneralRelativity.Instance, 0.5).D;

        Assert.True(qs.IsGeneralRelativity);
        Assert.Equal(dGr, dQs, 1e-15);
    }
}
