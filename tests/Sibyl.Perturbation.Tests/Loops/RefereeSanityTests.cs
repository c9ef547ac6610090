using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>The referee itself, checked against Einstein–de Sitter closed forms computed in other variables.</summary>
public sealed class RefereeSanityTests
{
    private static readonly LogSampledSpectrum Spectrum = new(InventedSpectra.Wiggly);

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.3)]
    public void Referee_EdS_P13_matches_the_reduced_kernel_integral(double k)
    {
        // P13_EdS = 4P(k) Σ X_s I_s(k) = k³P(k)/(1008π²) ∫dr P(kr) B(r) (Bernardeau et al. 2002, Phys. Rep. 367, 1;
        // from memory, verified numerically against the structures). The right side is a 1-D adaptive integral of the
        // series-assisted bracket. Tolerance 1e-6: both sides are asked for 1e-8 and cancel by ≲ 10×.
        var referee = new BruteForceReferee(Spectrum);
        double structures = 0.0;
        for (int s = 0; s < 6; s++)
        {
            if (DefinitionStructures.EdsP13Coefficients[s] != 0.0)
            {
                structures += DefinitionStructures.EdsP13Coefficients[s] * referee.P13((P13Structure)s, k);
            }
        }

        double pk = Spectrum.Evaluate(k);
        double fromStructures = 4.0 * pk * structures;
        double reduced = k * k * pk / (1008.0 * Math.PI * Math.PI) * BruteForceReferee.OuterIntegral(
            u =>
            {
                double q = Math.Exp(u);
                return q * Spectrum.Evaluate(q) * ReducedP13Kernel.Evaluate(q / k);
            },
            [Math.Log(Spectrum.QMin), Math.Log(k), Math.Log(Spectrum.QMax)]);
        Assert.Equal(reduced, fromStructures, Math.Abs(reduced) * 1e-6);
    }

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.3)]
    public void Referee_EdS_P22_matches_the_standard_F2_integral(double k)
    {
        // F2_EdS = α_s − (2/7)γ = (3r + 7x − 10rx²)/(14rp²) at (q, k − q), so
        // P22_EdS = k³/(392π²) ∫dr ∫dx P(kr) P(kp) (3r + 7x − 10rx²)²/p⁴ over the full region (no symmetry used),
        // against Σ X_S J_S from the referee's half-region (q, x) integrals with α_s, γ taken literally.
        // Tolerance 1e-6: both are adaptive to ~1e-8 but the full-region form has the p → 0 peak near r = x = 1.
        var referee = new BruteForceReferee(Spectrum);
        double[] p22 = referee.P22(k);
        double structures = 0.0;
        for (int s = 0; s < 3; s++)
        {
            structures += DefinitionStructures.EdsP22Coefficients[s] * p22[s];
        }

        double Outer(double u)
        {
            double r = Math.Exp(u) / k;
            double gap = Math.Abs(1.0 - r);
            // In t = ln p² (dx = −p² dt/(2r)) the p → 0 peak at r = x = 1 becomes bounded and smooth. Panels ≤ 1 wide
            // in t and ≤ 0.04 h/Mpc in p (wiggles), 16 Gauss–Legendre nodes each; below p² = 1e-30 the integrand is
            // negligible, and above the table's end P = 0, so the range stops there (no jump inside a panel).
            double lower = Math.Log(Math.Max(gap * gap, 1e-30));
            double upper = Math.Min(2.0 * Math.Log(1.0 + r), 2.0 * Math.Log(Spectrum.QMax / k));
            double Inner(double t)
            {
                double p2 = Math.Exp(t);
                double x = (1.0 + (r * r) - p2) / (2.0 * r);
                double numerator = (3.0 * r) + (7.0 * x) - (10.0 * r * x * x);
                return Spectrum.Evaluate(k * Math.Sqrt(p2)) * numerator * numerator / p2 / (2.0 * r);
            }

            if (upper <= lower)
            {
                return 0.0;
            }

            int panels = Math.Max((int)Math.Ceiling(upper - lower), (int)Math.Ceiling(2.0 * k * Math.Min(r, 1.0) / 0.04));
            double width = (upper - lower) / panels;
            double inner = 0.0;
            for (int i = 0; i < panels; i++)
            {
                inner += MathNet.Numerics.Integration.GaussLegendreRule.Integrate(Inner, lower + (i * width), lower + ((i + 1) * width), 16);
            }

            return r * Spectrum.Evaluate(k * r) * inner;
        }

        double standard = k * k * k / (392.0 * Math.PI * Math.PI)
            * BruteForceReferee.OuterIntegral(Outer, [Math.Log(Spectrum.QMin), Math.Log(0.5 * k), Math.Log(k), Math.Log(Spectrum.QMax)]);
        Assert.Equal(standard, structures, Math.Abs(standard) * 1e-6);
    }
}
