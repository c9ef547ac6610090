using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

public sealed class LoopQuadraturePhysicsTests
{
    private static readonly LogSampledSpectrum Wiggly = new(InventedSpectra.Wiggly);

    [Fact]
    public void Fast_EdS_P13_equals_the_reduced_kernel_integral()
    {
        // P13_EdS = 4P(k)ΣX_s I_s(k) = k³P(k)/(1008π²)∫dr P(kr)B(r) (Bernardeau et al. 2002, Phys. Rep. 367, 1; from
        // memory, verified numerically against the structures), the right side by a 1-D adaptive integral. Tolerance 1e-4:
        // ten times tighter than the 1e-3 target, since only resampling and quadrature differ (measured ≲ 2e-5).
        double[] k = [0.005, 0.02, 0.1, 0.3, 0.5];
        var plan = new LoopQuadrature(k);
        var result = new MomentumIntegrals(k.Length);
        plan.Compute(Wiggly, result);
        for (int i = 0; i < k.Length; i++)
        {
            double combination = 0.0;
            for (int s = 0; s < 6; s++)
            {
                combination += DefinitionStructures.EdsP13Coefficients[s] * result[(P13Structure)s][i];
            }

            double kk = k[i];
            double reduced = kk * kk / (1008.0 * Math.PI * Math.PI) * BruteForceReferee.OuterIntegral(
                u =>
                {
                    double q = Math.Exp(u);
                    return q * Wiggly.Evaluate(q) * ReducedP13Kernel.Evaluate(q / kk);
                },
                [Math.Log(Wiggly.QMin), Math.Log(kk), Math.Log(Wiggly.QMax)]);
            Assert.Equal(reduced, 4.0 * combination, Math.Abs(reduced) * 1e-4);
        }
    }

    [Fact]
    public void Low_k_EdS_P13_tends_to_minus_61_over_105_k2_sigma_v2_P()
    {
        // Mass and momentum conservation (Bernardeau et al. 2002, Phys. Rep. 367, 1; from memory):
        // P13_EdS → −(61/105) k² σ_v² P(k), σ_v² = (1/6π²)∫dq P(q), for k far below the spectrum's scale 0.1 h/Mpc.
        // At k = 1e-4 the next order is ~(k/0.1)² = 1e-6; tolerance 1e-4 covers the quadrature (≲ 2e-5).
        var spectrum = new LogSampledSpectrum(InventedSpectra.CutOff);
        double[] k = [1e-4];
        var plan = new LoopQuadrature(k);
        var result = new MomentumIntegrals(1);
        plan.Compute(spectrum, result);
        double combination = 0.0;
        for (int s = 0; s < 6; s++)
        {
            combination += DefinitionStructures.EdsP13Coefficients[s] * result[(P13Structure)s][0];
        }

        double sigmaV2 = BruteForceReferee.OuterIntegral(
            u => Math.Exp(u) * spectrum.Evaluate(Math.Exp(u)),
            [Math.Log(spectrum.QMin), Math.Log(spectrum.QMax)]) / (6.0 * Math.PI * Math.PI);
        double expected = -61.0 / 105.0 * k[0] * k[0] * sigmaV2;
        // P13/P(k) = 4ΣX_s I_s.
        Assert.Equal(expected, 4.0 * combination, Math.Abs(expected) * 1e-4);
    }

    [Fact]
    public void Low_k_EdS_P22_grows_as_k4_with_the_standard_coefficient()
    {
        // Mass and momentum conservation make F2 ∝ k² for q ≫ k, so P22_EdS ∝ k⁴ when P(k) itself is negligible
        // (Bernardeau et al. 2002, Phys. Rep. 367, 1). Coefficient from memory: P22 → (9/98) k⁴∫d³q/(2π)³ P²/q⁴
        // = (9/(196π²)) k⁴ ∫dq P²/q². The cut-off spectrum ∝ q⁴ makes the IR term k²P(k)σ_v² ~ 1e-6 of it.
        // Slope tolerance 1e-4 and coefficient 1e-4: next order (k/0.1)² ≈ 4e-6, quadrature ≲ 2e-5.
        var spectrum = new LogSampledSpectrum(InventedSpectra.CutOff);
        double[] k = [1e-4, 2e-4];
        var plan = new LoopQuadrature(k);
        var result = new MomentumIntegrals(2);
        plan.Compute(spectrum, result);
        double[] p22 = new double[2];
        for (int i = 0; i < 2; i++)
        {
            for (int s = 0; s < 3; s++)
            {
                p22[i] += DefinitionStructures.EdsP22Coefficients[s] * result[(P22Structure)s][i];
            }
        }

        double slope = Math.Log(p22[1] / p22[0]) / Math.Log(2.0);
        Assert.Equal(4.0, slope, 1e-4);
        double moment = BruteForceReferee.OuterIntegral(
            u =>
            {
                double q = Math.Exp(u);
                double p = spectrum.Evaluate(q);
                return p * p / q;
            },
            [Math.Log(spectrum.QMin), Math.Log(spectrum.QMax)]);
        double expected = 9.0 / (196.0 * Math.PI * Math.PI) * Math.Pow(k[0], 4) * moment;
        Assert.Equal(expected, p22[0], Math.Abs(expected) * 1e-4);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public void Fast_P22_integrals_of_a_power_law_match_the_Gamma_function_closed_form(int structure)
    {
        // Closed form by the master-integral expansion (Simonović et al. 2018, JCAP 04, 030; derived here).
        // n = −1/4 converges (−1 < n < 1/2). Table 1e-9…1e4 h/Mpc: truncation ~(1e-9/k)^0.75 + (k/1e4)^1.5 ≲ 2e-6;
        // resampling bias ~0.015 h⁴ n⁴ ≲ 1e-7. Tolerance 1e-4.
        const double n = -0.25;
        var spectrum = new LogSampledSpectrum(q => Math.Pow(q / 0.1, n), 1e-9, 1e4, 4096);
        double[] k = [0.05, 0.2];
        var plan = new LoopQuadrature(k, 1e-9, 1e4);
        var result = new MomentumIntegrals(2);
        plan.Compute(spectrum, result);
        double coefficient = PowerLawClosedForms.P22Coefficient(structure, n);
        for (int i = 0; i < k.Length; i++)
        {
            double expected = coefficient * Math.Pow(k[i] / 0.1, 2 * n) * k[i] * k[i] * k[i];
            Assert.Equal(expected, result[(P22Structure)structure][i], Math.Abs(expected) * 1e-4);
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    public void Fast_P13_integrals_of_a_power_law_match_the_Gamma_function_closed_form(int structure)
    {
        // Same method (Simonović et al. 2018, JCAP 04, 030). These four kernels are O(1) at r → 0 and O(r⁻²) at
        // r → ∞, so I_s converges for −3 < n < −1 (AlphaAlpha and BetaAlpha grow as r⁻² at small r and never do).
        // n = −2, table 1e-9…1e5: truncation ~(1e-9/k) + (k/1e5) ≲ 2e-6; resampling bias ~0.015 h⁴n⁴ ≲ 1e-5. Tolerance 1e-4.
        const double n = -2.0;
        var spectrum = new LogSampledSpectrum(q => Math.Pow(q / 0.1, n), 1e-9, 1e5, 4096);
        double[] k = [0.05, 0.2];
        var plan = new LoopQuadrature(k, 1e-9, 1e5);
        var result = new MomentumIntegrals(2);
        plan.Compute(spectrum, result);
        double coefficient = PowerLawClosedForms.P13Coefficient(structure, n);
        for (int i = 0; i < k.Length; i++)
        {
            double expected = coefficient * Math.Pow(k[i] / 0.1, n) * k[i] * k[i] * k[i];
            Assert.Equal(expected, result[(P13Structure)structure][i], Math.Abs(expected) * 1e-4);
        }
    }

    [Fact]
    public void Master_integral_normalisation_matches_the_elementary_case()
    {
        // ∫d³q/(q²|k − q|²) = π³/k (elementary, e.g. by Feynman parameters), so with d³q/(2π)³ the coefficient is 1/8.
        Assert.Equal(0.125, PowerLawClosedForms.Master(1.0, 1.0), 1e-14);
    }

    [Fact]
    public void Two_spectra_at_once_give_exactly_the_single_spectrum_results()
    {
        // Sharing passes over the weights must not change any sum: the same accumulations in the same order.
        var smooth = new LogSampledSpectrum(InventedSpectra.Smooth);
        double[] k = [0.01, 0.1, 0.4];
        var plan = new LoopQuadrature(k);
        var together = (new MomentumIntegrals(3), new MomentumIntegrals(3));
        var alone = (new MomentumIntegrals(3), new MomentumIntegrals(3));
        plan.Compute(Wiggly, smooth, together.Item1, together.Item2);
        plan.Compute(Wiggly, alone.Item1);
        plan.Compute(smooth, alone.Item2);
        for (int s = 0; s < 6; s++)
        {
            Assert.Equal(alone.Item1[(P13Structure)s].ToArray(), together.Item1[(P13Structure)s].ToArray());
            Assert.Equal(alone.Item2[(P13Structure)s].ToArray(), together.Item2[(P13Structure)s].ToArray());
        }

        for (int s = 0; s < 3; s++)
        {
            Assert.Equal(alone.Item1[(P22Structure)s].ToArray(), together.Item1[(P22Structure)s].ToArray());
            Assert.Equal(alone.Item2[(P22Structure)s].ToArray(), together.Item2[(P22Structure)s].ToArray());
        }
    }
}
