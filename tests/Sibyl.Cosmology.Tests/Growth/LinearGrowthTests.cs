using MathNet.Numerics.Integration;
using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Growth;

namespace Sibyl.Cosmology.Tests.Growth;

public class LinearGrowthTests
{
    [Theory]
    [InlineData(0.3, 1.0)]
    [InlineData(0.3, 0.5)]
    [InlineData(0.3, 0.2)]
    [InlineData(0.1, 1.0)]
    [InlineData(0.7, 0.8)]
    public void Growth_matches_Heath_integral_for_LCDM(double omegaM, double a)
    {
        // Heath (1977, MNRAS 179, 351): for ΛCDM, D(a) = (5Ω_m/2) E(a) ∫_0^a da'/(a'E(a'))³,
        // normalised so D → a early, the convention of LinearGrowth. Evaluated here by adaptive
        // Gauss–Kronrod (MathNet) to 1e-12, so the 1e-6 tolerance (the issue's) tests our ODE alone.
        var background = new ExpansionHistory(omegaM);
        double integral = GaussKronrodRule.Integrate(
            x => Math.Pow(x * background.Hubble(x), -3), 0.0, a, out _, out _, 1e-13, 25, 61);
        double heath = 2.5 * omegaM * background.Hubble(a) * integral;

        var growth = LinearGrowth.Solve(background, GeneralRelativity.Instance, a);

        Assert.Equal(1.0, growth.D / heath, 1e-6);
    }

    [Fact]
    public void Growth_rate_matches_derivative_of_Heath_integral()
    {
        // f = d ln D/d ln a from the Heath form: f = d ln E/d ln a + a / (a E)³ / I(a) · ... written out:
        // D = (5Ω_m/2) E I, so f = dlnE/dlna + a (aE)^{-3} / I. Tolerance 1e-6 as for D.
        const double omegaM = 0.3, a = 0.7;
        var background = new ExpansionHistory(omegaM);
        double integral = GaussKronrodRule.Integrate(x => Math.Pow(x * background.Hubble(x), -3), 0.0, a, out _, out _, 1e-13, 25, 61);
        double f = background.HubbleLogSlope(a) + a * Math.Pow(a * background.Hubble(a), -3) / integral;

        Assert.Equal(f, LinearGrowth.Solve(background, GeneralRelativity.Instance, a).F, 1e-6);
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(0.3)]
    [InlineData(1e-3)]
    public void Growth_is_Einstein_de_Sitter_when_matter_is_everything(double a)
    {
        // Ω_m = 1: D = a and f = 1 exactly (Peebles 1980, The Large-Scale Structure of the Universe §11).
        // 1e-9 allows for the RK4 truncation error of 200 steps per e-fold.
        var growth = LinearGrowth.Solve(new ExpansionHistory(1.0), GeneralRelativity.Instance, a);

        Assert.Equal(a, growth.D, a * 1e-9);
        Assert.Equal(1.0, growth.F, 1e-9);
    }

    [Theory]
    [InlineData(0.35, 1.0)]
    [InlineData(0.3, 0.5)]
    [InlineData(0.25, 0.67)]
    [InlineData(0.5, 1.0)]
    public void Growth_rate_follows_Linder_index_for_LCDM(double omegaM, double a)
    {
        // Linder (2005, PRD 72, 043529): f ≈ Ω_m(a)^0.55 in ΛCDM, good to a few tenths of a per cent
        // (common practice); the issue asks for 0.5 %. That holds for Ω_m(a) ≥ 0.35: at Ω_m(a) = 0.3
        // the exact index is 0.5547 (checked against Heath's integral above), and 0.55 is then 0.57 % off,
        // which is the rule of thumb's own error, not the solver's.
        var background = new ExpansionHistory(omegaM);
        double linder = Math.Pow(background.OmegaMatterAt(a), 0.55);

        double f = LinearGrowth.Solve(background, GeneralRelativity.Instance, a).F;

        Assert.InRange(f / linder, 0.995, 1.005);
    }

    [Fact]
    public void Phantom_dark_energy_grows_less_today_than_LCDM_at_fixed_Omega_m()
    {
        // With w < −1 dark energy is subdominant for longer, so growth is suppressed later and D(1) is
        // larger than in ΛCDM (Linder 2005, fig. 1, qualitative); the sign is the check here.
        double lcdm = LinearGrowth.Solve(new ExpansionHistory(0.3), GeneralRelativity.Instance, 1.0).D;
        double phantom = LinearGrowth.Solve(new ExpansionHistory(0.3, -1.2, 0.0), GeneralRelativity.Instance, 1.0).D;
        double quintessence = LinearGrowth.Solve(new ExpansionHistory(0.3, -0.8, 0.0), GeneralRelativity.Instance, 1.0).D;

        Assert.True(phantom > lcdm && lcdm > quintessence);
    }
}
