using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.Kernels;

public class RedshiftSpaceKernelsTests
{
    private static readonly ExpansionHistory Lcdm = new(0.31);
    private static readonly GalaxyBias Bias = new(1.7, -0.4, -0.3, 0.2);

    [Fact]
    public void Second_order_kernel_in_EdS_matches_the_standard_form()
    {
        // Scoccimarro, Couchman & Frieman (1999, ApJ 517, 531) eq. for Z2 with the bias of Assassi et al.
        // (2014): Z2 = b1F2 + fμ²G2 + (fμk/2)[μ1/k1 (b1 + fμ2²) + μ2/k2 (b1 + fμ1²)] + b2/2 + bG2 S2,
        // here with the EdS F2, G2 written out (Bernardeau et al. 2002 eq. 45–46), f = 1. Tolerance 1e-6
        // from the RK4 error on the EdS coefficients.
        var z = new RedshiftSpaceKernels(new MatterKernels(TimeCoefficientSolver.Solve(new ExpansionHistory(1.0), GeneralRelativity.Instance, 1.0)), Bias);
        var k1 = new Wavevector(0.05, 0.02, 0.08);
        var k2 = new Wavevector(-0.03, 0.06, 0.01);
        var k = k1 + k2;
        double cos = Wavevector.Dot(k1, k2) / (k1.Length * k2.Length);
        double ratio = k1.Length / k2.Length + k2.Length / k1.Length;
        double f2 = 5.0 / 7.0 + 0.5 * cos * ratio + 2.0 / 7.0 * cos * cos;
        double g2 = 3.0 / 7.0 + 0.5 * cos * ratio + 4.0 / 7.0 * cos * cos;
        double mu = k.Z / k.Length, mu1 = k1.Z / k1.Length, mu2 = k2.Z / k2.Length;
        double expected = Bias.B1 * f2 + mu * mu * g2
                          + 0.5 * mu * k.Length * (mu1 / k1.Length * (Bias.B1 + mu2 * mu2) + mu2 / k2.Length * (Bias.B1 + mu1 * mu1))
                          + 0.5 * Bias.B2 + Bias.BG2 * (cos * cos - 1.0);

        Assert.Equal(expected, z.Z2(k1, k2), 1e-6);
    }

    [Theory]
    [InlineData("lcdm")]
    [InlineData("ndgp")]
    public void Soft_limit_of_third_order_kernel_is_the_redshift_space_displacement(string model)
    {
        // Equivalence principle in redshift space: a long mode q only shifts short ones by
        // Ψ_s = Ψ + f(Ψ·ẑ)ẑ, so Z3(k, q, −q) → −(1/6)[(k·q) + f k_z q_z]²/q⁴ · Z1(k) as q → 0 for any
        // scale-independent growth (Scoccimarro & Frieman 1996, ApJS 105, 37 in real space; Ivanov &
        // Sibiryakov 2018, JCAP 07, 053 in redshift space). At q = 1e-4 k the next order is 1e-4: tolerance 1e-3.
        IGravityModel gravity = model == "lcdm" ? GeneralRelativity.Instance : new NormalBranchDgp(Lcdm, 0.25);
        var matter = new MatterKernels(TimeCoefficientSolver.Solve(Lcdm, gravity, 0.6));
        var z = new RedshiftSpaceKernels(matter, Bias);
        var k = new Wavevector(0.06, 0.03, 0.08);
        var q = new Wavevector(3e-6, -7e-6, 5e-6);

        double shift = Wavevector.Dot(k, q) + matter.F * k.Z * q.Z;
        double expected = -shift * shift / (6.0 * q.LengthSquared * q.LengthSquared) * z.Z1(k);

        Assert.Equal(1.0, z.Z3(k, q, -q) / expected, 1e-3);
    }

    [Fact]
    public void Kernels_across_the_line_of_sight_are_the_real_space_biased_kernels()
    {
        // With every wavevector perpendicular to ẑ the mapping adds nothing: Z_n = δ_g kernels.
        var matter = new MatterKernels(TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 0.7));
        var z = new RedshiftSpaceKernels(matter, Bias);
        var k1 = new Wavevector(0.05, 0.02, 0.0);
        var k2 = new Wavevector(-0.03, 0.06, 0.0);
        var k3 = new Wavevector(0.01, -0.04, 0.0);

        Assert.Equal(Bias.B1, z.Z1(k1), 1e-15);
        Assert.Equal(Bias.B1 * matter.F2(k1, k2) + 0.5 * Bias.B2 - Bias.BG2 * ModeCoupling.Gamma(k1, k2), z.Z2(k1, k2), 1e-14);
        Assert.True(Math.Abs(z.Z3(k1, k2, k3) - Bias.B1 * matter.F3(k1, k2, k3)) > 0.0, "the bias terms of Z3 act in real space too");
    }
}
