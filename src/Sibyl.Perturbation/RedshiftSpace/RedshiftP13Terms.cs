using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// P_13 of the redshift-space galaxy spectrum, P_13(k, μ) = 6 Z1(k) P(k) ∫d³q/(2π)³ Z3(k, q, −q) P(q), reduced to
/// the six matter angular kernels, the two <see cref="DisplacementKernels"/> and σ_v². With Z1 = b1 + fμ²,
/// I_s the matter P_13 integrals and the normalised coefficients of <see cref="RedshiftTimeInputs"/>:
/// <code>
/// P_13 = 4 Z1 P [ b1 A + B + bG2 C + bΓ3 E ] − f² k² μ² σ_v² Z1² P,
/// A = Σ x_s I_s + μ² (f I_αα + ṽ I_αγ),
/// B = μ² Σ y_s I_s + f μ⁴ [f (I_Dα + I_γα/2) + ṽ (I_Dγ + I_γγ/2)] − (f μ²/2)(f I_γα + ṽ I_γγ),
/// C = −2 (I_γα + b̃ I_γγ),   E = −2 (b̃ − ṽ/f) I_γγ,
/// </code>
/// derived from the ordered terms of <see cref="Kernels.RedshiftSpaceKernels"/> averaged over the azimuth of q
/// (derivation in DEVELOPERS.md) and checked against brute-force integration of Z3 itself in the tests.
/// </summary>
internal static class RedshiftP13Terms
{
    /// <summary>Adds P_13 at wavenumber index <paramref name="i"/> into a <see cref="MuPolynomials"/> block.</summary>
    /// <param name="block">Destination block (accumulated into).</param>
    /// <param name="matter">Matter P_13 integrals I_s of the spectrum.</param>
    /// <param name="displacement">I_Dα, I_Dγ of the spectrum, structure-major over k.</param>
    /// <param name="sigmaV2">σ_v² of the spectrum, (Mpc/h)².</param>
    /// <param name="i">Index of k.</param>
    /// <param name="k">Wavenumber, h/Mpc.</param>
    /// <param name="power">P(k) of the spectrum.</param>
    /// <param name="t">Normalised time inputs.</param>
    public static void Add(Span<double> block, MomentumIntegrals matter, ReadOnlySpan<double> displacement, double sigmaV2, int i, double k, double power, RedshiftTimeInputs t)
    {
        int kCount = matter.KCount;
        double f = t.MappedGrowthRate, v = t.MappedVelocityGamma, bt = t.DensityGamma;
        double iAA = matter[P13Structure.AlphaAlpha][i], iAG = matter[P13Structure.AlphaGamma][i];
        double iGA = matter[P13Structure.GammaAlpha][i], iGG = matter[P13Structure.GammaGamma][i];
        double iDA = displacement[(DisplacementKernels.Alpha * kCount) + i];
        double iDG = displacement[(DisplacementKernels.Gamma * kCount) + i];

        double densitySum = 0.0, velocitySum = 0.0;
        foreach (var (time, loop) in P13TimeStructures.Pairs)
        {
            densitySum += t.Density[(int)time] * matter[loop][i];
            velocitySum += t.Velocity[(int)time] * matter[loop][i];
        }

        velocitySum *= t.MappingScale;
        double a0 = densitySum, a1 = (f * iAA) + (v * iAG);
        double b1 = velocitySum - (0.5 * f * ((f * iGA) + (v * iGG)));
        double b2 = f * ((f * (iDA + (0.5 * iGA))) + (v * (iDG + (0.5 * iGG))));
        double c0 = -2.0 * (iGA + (bt * iGG));
        double e0 = -2.0 * t.TidalDifference * iGG;
        double p4 = 4.0 * power;
        double s = f * f * k * k * sigmaV2 * power;

        // 4 Z1 P (b1 A + B + bG2 C + bΓ3 E) with Z1 = b1 + f μ², then the σ_v² term − s μ² (b1 + f μ²)².
        MuPolynomials.Add(block, GalaxyMonomial.B1B1, 0, p4 * a0);
        MuPolynomials.Add(block, GalaxyMonomial.B1B1, 1, (p4 * a1) - s);
        MuPolynomials.Add(block, GalaxyMonomial.B1, 1, p4 * ((f * a0) + b1));
        MuPolynomials.Add(block, GalaxyMonomial.B1, 2, (p4 * ((f * a1) + b2)) - (2.0 * f * s));
        MuPolynomials.Add(block, GalaxyMonomial.One, 2, p4 * f * b1);
        MuPolynomials.Add(block, GalaxyMonomial.One, 3, (p4 * f * b2) - (f * f * s));
        MuPolynomials.Add(block, GalaxyMonomial.B1BG2, 0, p4 * c0);
        MuPolynomials.Add(block, GalaxyMonomial.BG2, 1, p4 * f * c0);
        MuPolynomials.Add(block, GalaxyMonomial.B1BGamma3, 0, p4 * e0);
        MuPolynomials.Add(block, GalaxyMonomial.BGamma3, 1, p4 * f * e0);
    }
}
