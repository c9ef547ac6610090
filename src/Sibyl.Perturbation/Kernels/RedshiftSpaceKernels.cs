namespace Sibyl.Perturbation.Kernels;

/// <summary>
/// Redshift-space galaxy kernels Z1–Z3 from the exact mapping
/// δ_s(k) = ∫d³x e^{−ik·x} e^{−i k_z u_z(x)} [1 + δ_g(x)] − (2π)³δ_D(k), u_z(k) = i (k_z/k²) Θ(k)
/// (Scoccimarro, Couchman &amp; Frieman 1999, ApJ 517, 531), expanded order by order with the
/// exact-time density and velocity kernels of <see cref="MatterKernels"/> and the bias of
/// <see cref="GalaxyBias"/>. No Einstein–de Sitter relation between F_n and V_n is assumed.
/// Vectors in h/Mpc; the line of sight is +z.
/// </summary>
public sealed class RedshiftSpaceKernels(MatterKernels matter, GalaxyBias bias)
{
    /// <summary>Z1 = b1 + f μ².</summary>
    public double Z1(Wavevector k) => bias.B1 + matter.F * Mu2(k);

    /// <summary>Symmetric Z2(k1, k2).</summary>
    public double Z2(Wavevector k1, Wavevector k2) => 0.5 * (Z2Ordered(k1, k2) + Z2Ordered(k2, k1));

    /// <summary>
    /// Symmetric Z3(k1, k2, k3) without b2: in P_13, b2 appears only in terms ∝ σ² P_L that renormalise
    /// b1 or the mean density (the tadpole), as is common practice (Assassi et al. 2014).
    /// </summary>
    public double Z3(Wavevector k1, Wavevector k2, Wavevector k3) =>
        (Z3Ordered(k1, k2, k3) + Z3Ordered(k1, k3, k2) + Z3Ordered(k2, k1, k3)
         + Z3Ordered(k2, k3, k1) + Z3Ordered(k3, k1, k2) + Z3Ordered(k3, k2, k1)) / 6.0
        + bias.B1 * matter.F3(k1, k2, k3) + Mu2(k1 + k2 + k3) * matter.V3(k1, k2, k3);

    private double Z2Ordered(Wavevector k1, Wavevector k2)
    {
        var k = k1 + k2;
        double f = matter.F;
        double kz = k.Z;
        double galaxy = bias.B1 * matter.F2(k1, k2) + 0.5 * bias.B2 - bias.BG2 * ModeCoupling.Gamma(k1, k2);
        return galaxy
               + Mu2(k) * matter.V2(k1, k2)
               + kz * Displacement(k1) * f * bias.B1
               + 0.5 * kz * kz * Displacement(k1) * Displacement(k2) * f * f;
    }

    /// <summary>The ordered (k1 outer, (k2, k3) inner pair) mapping and bias terms, without F3 and V3.</summary>
    private double Z3Ordered(Wavevector k1, Wavevector k2, Wavevector k3)
    {
        var pair = k2 + k3;
        var k = k1 + pair;
        double f = matter.F, kz = k.Z;
        double d1 = Displacement(k1);
        double result = 0.5 * kz * kz * d1 * Displacement(k2) * f * f * bias.B1
                        + kz * kz * kz * d1 * Displacement(k2) * Displacement(k3) * f * f * f / 6.0;

        if (pair.LengthSquared <= 1e-24 * (k2.LengthSquared + k3.LengthSquared))
        {
            // Every second-order kernel of a pair summing to zero vanishes (F2, V2, S2 of (q, −q) are 0;
            // the b2 tadpole is removed with b2 itself).
            return result;
        }

        double f2 = matter.F2(k2, k3), v2 = matter.V2(k2, k3), tidal = -ModeCoupling.Gamma(k2, k3);
        double outerTidal = -ModeCoupling.Gamma(k1, pair);
        result += 2.0 * bias.BG2 * outerTidal * f2
                  + 2.0 * bias.BGamma3 * outerTidal * (f2 - v2 / f)
                  + kz * d1 * f * (bias.B1 * f2 + bias.BG2 * tidal)
                  + kz * Displacement(pair) * v2 * bias.B1
                  + kz * kz * d1 * f * Displacement(pair) * v2;
        return result;
    }

    /// <summary>q_z/q²: the line-of-sight displacement per unit velocity divergence.</summary>
    private static double Displacement(Wavevector q) => q.Z / q.LengthSquared;

    private static double Mu2(Wavevector k) => k.Z * k.Z / k.LengthSquared;
}
