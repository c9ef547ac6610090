using MathNet.Numerics.Integration;
using Sibyl.Cosmology.Linear;

namespace Sibyl.Cosmology.Tests.Linear;

public class EisensteinHuTests
{
    // Planck 2018 VI (A&A 641, A6) base-ΛCDM best fit, values from memory: ω_b = 0.02242, ω_c = 0.11933, h = 0.6766.
    private static readonly EisensteinHu Planck = new(0.02242, 0.11933, 0.6766);

    [Fact]
    public void Sound_horizon_equals_the_integral_it_solves()
    {
        // EH98 eq. 6 is the closed form of s = ∫_0^{t_d} c_s dt/a in a matter + radiation universe with
        // R = 3ρ_b/4ρ_γ ∝ a (their eqs. 2, 3, 5). Integrate that directly in a (MathNet Gauss–Kronrod):
        // s = ∫_0^{a_d} c/√(3(1+R(a))) da / (a² H(a)), H = H0 √(Ω_m a⁻³ (1 + a_eq/a)), to 1e-10, so the
        // 1e-6 tolerance tests our transcription of eq. 6 alone.
        double theta = 2.7255 / 2.7;
        double wm = 0.02242 + 0.11933;
        double aEq = 1.0 / (1.0 + Planck.ZEquality);
        double aD = 1.0 / (1.0 + Planck.ZDrag);
        double rPerA = 31.5 * 0.02242 / Math.Pow(theta, 4) * 1000.0;       // R(a) = rPerA · a, eq. 5
        const double c = 299792.458;                                          // km/s
        double h0TimesRootOmegaM = 100.0 * Math.Sqrt(wm);                    // H0 √Ω_m in km/s/Mpc
        double integral = GaussKronrodRule.Integrate(
            a => c / Math.Sqrt(3.0 * (1.0 + rPerA * a)) / (h0TimesRootOmegaM * Math.Sqrt(a + aEq)),
            0.0, aD, out _, out _, 1e-12, 25, 61);
        // The k_eq of eq. 3 is the (aH) at equality: k_eq = √(2 Ω_m H0² a_eq⁻¹)/c. EH98 round it to
        // 7.46e-2 ω_m θ⁻² Mpc⁻¹, which fixes a_eq at 1/(2.50e4 ω_m θ⁻⁴) only to their quoted digits,
        // so the two agree to the 3 significant figures of those constants: tolerance 2e-3.
        Assert.Equal(1.0, Planck.SoundHorizon / integral, 2e-3);
    }

    [Fact]
    public void Approximate_sound_horizon_agrees_with_the_exact_one_to_the_stated_accuracy()
    {
        // EH98 eq. 26 is quoted (from memory) as good to 2 % for 0.0125 ≲ ω_b and 0.025 ≲ ω_m ≲ 0.5.
        foreach (var (wb, wc) in new[] { (0.0224, 0.12), (0.015, 0.10), (0.03, 0.2), (0.02, 0.06) })
        {
            var fit = new EisensteinHu(wb, wc, 0.7);
            Assert.InRange(fit.ApproximateSoundHorizon / fit.SoundHorizon, 0.98, 1.02);
        }
    }

    [Fact]
    public void Drag_epoch_and_sound_horizon_sit_at_the_known_offsets_from_a_Boltzmann_solution()
    {
        // Planck 2018 VI Table 2 (from memory): z_drag = 1059.9, r_drag = 147.1 Mpc. EH98 define the drag
        // epoch through their own fit (eq. 4), which lands near z ≈ 1020, about 4 % lower, and eq. 6 then
        // gives a sound horizon about 3 % longer (both offsets known from use of the formula, common
        // practice). Checking sign and size guards against a transcription error of eqs. 4–6, which would
        // move them by far more.
        Assert.InRange(Planck.ZDrag / 1059.9, 0.95, 0.98);
        Assert.InRange(Planck.SoundHorizon / 147.1, 1.01, 1.04);
    }

    [Fact]
    public void Transfer_function_tends_to_one_on_large_scales()
    {
        // T(k → 0) = 1 by construction of EH98 eqs. 16–21 (all pieces → 1, j0 → 1); 1e-4 at k = 1e-5/Mpc.
        Assert.Equal(1.0, Planck.Transfer(1e-5), 1e-4);
        Assert.Equal(1.0, Planck.NoWiggleTransfer(1e-5), 1e-4);
    }

    [Fact]
    public void Wiggle_and_no_wiggle_forms_share_the_broadband()
    {
        // EH98 §4.2 builds the zero-baryon form to track the broadband of the full one; its wiggles are
        // a few per cent, so the ratio of the two stays within 10 % from 0.01 to 1 /Mpc.
        for (double k = 0.01; k < 1.0; k *= 1.1)
        {
            Assert.InRange(Planck.Transfer(k) / Planck.NoWiggleTransfer(k), 0.9, 1.1);
        }
    }
}
