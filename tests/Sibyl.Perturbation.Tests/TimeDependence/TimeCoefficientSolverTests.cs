using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Growth;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.TimeDependence;

public class TimeCoefficientSolverTests
{
    private static readonly ExpansionHistory Lcdm = new(0.31);

    [Theory]
    [InlineData(1.0)]
    [InlineData(0.4)]
    public void Einstein_de_Sitter_numbers_come_out_as_the_Omega_m_to_one_limit(double a)
    {
        // EdS kernels (Bernardeau et al. 2002, Phys. Rep. 367, 1, eqs. 45–46 and the standard F3):
        // F2 = 5/7 + (μ/2)(k1/k2 + k2/k1) + (2/7)μ², i.e. B = −(2/7)a², B' = −(4/7)a², and the F3 structures
        // 7/18, −2/9, 2/9, −8/63 (verified against the reduced EdS P13 kernel in the loop tests).
        // The solver starts at a = 1e-3 and integrates through; 2e-7 covers the RK4 truncation error.
        var c = TimeCoefficientSolver.Solve(new ExpansionHistory(1.0), GeneralRelativity.Instance, a);
        double a3 = a * a * a;

        Assert.Equal(a, c.D, 2e-7 * a);
        Assert.Equal(1.0, c.F, 2e-7);
        Assert.Equal(-2.0 / 7.0, c.B / (a * a), 2e-7);
        Assert.Equal(-4.0 / 7.0, c.BPrime / (a * a), 2e-7);
        Assert.Equal(7.0 / 18.0, c.Density(ThirdOrderStructure.AlphaAlpha) / a3, 2e-7);
        Assert.Equal(-2.0 / 9.0, c.Density(ThirdOrderStructure.AlphaGamma) / a3, 2e-7);
        Assert.Equal(2.0 / 9.0, c.Density(ThirdOrderStructure.BetaAlpha) / a3, 2e-7);
        Assert.Equal(-8.0 / 63.0, c.Density(ThirdOrderStructure.BetaGamma) / a3, 2e-7);
        Assert.Equal(0.0, c.Density(ThirdOrderStructure.GammaAlpha), 0.0);
        Assert.Equal(0.0, c.Density(ThirdOrderStructure.GammaGamma), 0.0);
    }

    [Fact]
    public void Linear_growth_agrees_with_the_linear_solver()
    {
        // Two independent integrations of the same equation (different start and step): 1e-6.
        var c = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 0.6);
        var g = LinearGrowth.Solve(Lcdm, GeneralRelativity.Instance, 0.6);

        Assert.Equal(1.0, c.D / g.D, 1e-6);
        Assert.Equal(g.F, c.F, 1e-6);
    }

    [Fact]
    public void Second_order_coefficient_in_LCDM_is_close_to_the_Bouchet_approximation()
    {
        // Bouchet, Colombi, Hivon & Juszkiewicz (1995, A&A 296, 575), quoted in Bernardeau et al. 2002
        // (from memory): F2 = (1 + ε)/2 + … with ε ≈ (3/7) Ω_m^{−1/143} for flat ΛCDM, so B/D² = (ε − 1)/2.
        // The fit is good to about 1e-3 in ε; the ΛCDM departure from EdS itself is ~2e-3 here.
        var c = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 1.0);
        double epsilon = 3.0 / 7.0 * Math.Pow(Lcdm.OmegaMatterAt(1.0), -1.0 / 143.0);

        Assert.Equal((epsilon - 1.0) / 2.0, c.B / (c.D * c.D), 5e-4);
        Assert.True(Math.Abs(c.B / (c.D * c.D) + 2.0 / 7.0) > 1e-3, "LCDM must differ from EdS at the 1e-3 level");
    }

    public static TheoryData<string> Models => ["lcdm", "w0wa", "ndgp", "qs"];

    [Theory]
    [MemberData(nameof(Models))]
    public void Galilean_invariance_fixes_the_infrared_combination_of_third_order_coefficients(string name)
    {
        // The equivalence principle makes the q → 0 limit of F3(k, q, −q) equal −(k·q)²/(6q⁴)·D³ for
        // any scale-independent μ(a) (the IR limit of P_13 is −k²σ_v²P_L; Scoccimarro & Frieman 1996,
        // ApJS 105, 37; Peloso & Pietroni 2013, JCAP 05, 031). With the structures' q → 0 angular
        // limits (−1/3 for AlphaAlpha, −1/6 for BetaAlpha, 0 for the rest) that is 2 X_AlphaAlpha + X_BetaAlpha = D³,
        // which the ODE system must keep exactly: 1e-7 for truncation.
        var (background, gravity) = Model(name);
        var c = TimeCoefficientSolver.Solve(background, gravity, 0.8);

        double combination = 2.0 * c.Density(ThirdOrderStructure.AlphaAlpha) + c.Density(ThirdOrderStructure.BetaAlpha);

        Assert.Equal(1.0, combination / (c.D * c.D * c.D), 1e-7);
    }

    [Fact]
    public void Ndgp_coefficients_tend_to_LCDM_as_Omega_rc_vanishes()
    {
        // μ − 1 and the vertices vanish like √Ω_rc; at Ω_rc = 1e-8 every coefficient is within 1e-4 of ΛCDM.
        var gr = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 1.0);
        var dgp = TimeCoefficientSolver.Solve(Lcdm, new NormalBranchDgp(Lcdm, 1e-8), 1.0);

        Assert.Equal(1.0, dgp.D / gr.D, 1e-4);
        Assert.Equal(1.0, dgp.B / gr.B, 1e-4);
        foreach (var s in new[] { ThirdOrderStructure.AlphaAlpha, ThirdOrderStructure.AlphaGamma, ThirdOrderStructure.BetaAlpha, ThirdOrderStructure.BetaGamma })
        {
            Assert.Equal(1.0, dgp.Density(s) / gr.Density(s), 1e-4);
        }

        Assert.Equal(0.0, dgp.Density(ThirdOrderStructure.GammaGamma) / gr.Density(ThirdOrderStructure.AlphaAlpha), 1e-4);
    }

    [Fact]
    public void Ndgp_screening_makes_the_second_order_coefficient_more_negative()
    {
        // γ2 < 0 in nDGP (Vainshtein screening, Koyama et al. 2009), which sources a more negative B than
        // the enhanced linear growth alone: B/D² must drop below its ΛCDM value.
        var gr = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 1.0);
        var dgp = TimeCoefficientSolver.Solve(Lcdm, new NormalBranchDgp(Lcdm, 0.25), 1.0);
        var noVertex = TimeCoefficientSolver.Solve(Lcdm, new QuasiStaticLike(new NormalBranchDgp(Lcdm, 0.25)), 1.0);

        Assert.True(dgp.B / (dgp.D * dgp.D) < noVertex.B / (noVertex.D * noVertex.D));
        Assert.True(dgp.D > gr.D);
    }

    [Fact]
    public void Coefficients_at_several_redshifts_equal_separate_solutions()
    {
        var many = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, [1.0, 0.5, 0.25]);
        var single = TimeCoefficientSolver.Solve(Lcdm, GeneralRelativity.Instance, 0.5);

        Assert.Equal(single.B, many[1].B, Math.Abs(single.B) * 1e-6);
        Assert.Equal(0.5, many[1].ScaleFactor, 1e-12);
    }

    private static (ExpansionHistory, IGravityModel) Model(string name) => name switch
    {
        "lcdm" => (Lcdm, GeneralRelativity.Instance),
        "w0wa" => (new ExpansionHistory(0.31, -0.9, -0.3), GeneralRelativity.Instance),
        "ndgp" => (Lcdm, new NormalBranchDgp(Lcdm, 0.25)),
        "qs" => (Lcdm, new QuasiStaticModification(Lcdm, 0.2, -0.05, 0.02)),
        _ => throw new ArgumentOutOfRangeException(nameof(name)),
    };

    /// <summary>nDGP's μ(a) without its vertices, to isolate the vertices' effect.</summary>
    private sealed class QuasiStaticLike(IGravityModel inner) : IGravityModel
    {
        public string Name => "ndgp-linear-only";

        public double Mu(double a) => inner.Mu(a);

        public double QuadraticVertex(double a) => 0.0;

        public double CubicVertex(double a) => 0.0;

        public bool IsGeneralRelativity => false;
    }
}
