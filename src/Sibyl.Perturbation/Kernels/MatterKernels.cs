using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Kernels;

/// <summary>
/// Density and velocity-divergence kernels F_n, V_n at one time, normalised to the linear density
/// (δ = Σ F_n δ_L^n, Θ = Σ V_n δ_L^n, so F1 = 1 and V1 = f), with the exact time dependence of
/// <see cref="TimeCoefficients"/>; symmetric in their arguments. Used where vectors are at hand
/// (referees, redshift-space mapping); the loop integrals use the structures' angular integrals instead.
/// </summary>
public sealed class MatterKernels
{
    private readonly double[] _x = new double[7];
    private readonly double[] _y = new double[7];

    /// <summary>Normalises <paramref name="coefficients"/> by powers of D (and f for velocities).</summary>
    public MatterKernels(TimeCoefficients coefficients)
    {
        ArgumentNullException.ThrowIfNull(coefficients);
        double d = coefficients.D, d2 = d * d, d3 = d2 * d;
        F = coefficients.F;
        SecondDensityGamma = coefficients.B / d2;
        SecondVelocityGamma = coefficients.BPrime / d2;
        foreach (ThirdOrderStructure s in Enum.GetValues<ThirdOrderStructure>())
        {
            _x[(int)s] = coefficients.Density(s) / d3;
            _y[(int)s] = coefficients.Velocity(s) / d3;
        }
    }

    /// <summary>Growth rate f.</summary>
    public double F { get; }

    /// <summary>B/D², the γ coefficient of F2 (−2/7 in EdS).</summary>
    public double SecondDensityGamma { get; }

    /// <summary>B'/D², the γ coefficient of V2 (−4/7 in EdS, where V2 = f G2).</summary>
    public double SecondVelocityGamma { get; }

    /// <summary>F2(k1, k2) = α_s + (B/D²) γ.</summary>
    public double F2(Wavevector k1, Wavevector k2) =>
        ModeCoupling.AlphaSymmetric(k1, k2) + SecondDensityGamma * ModeCoupling.Gamma(k1, k2);

    /// <summary>V2(k1, k2) = f α_s + (B'/D²) γ.</summary>
    public double V2(Wavevector k1, Wavevector k2) =>
        F * ModeCoupling.AlphaSymmetric(k1, k2) + SecondVelocityGamma * ModeCoupling.Gamma(k1, k2);

    /// <summary>Symmetrised F3.</summary>
    public double F3(Wavevector k1, Wavevector k2, Wavevector k3) => Symmetrised(_x, k1, k2, k3);

    /// <summary>Symmetrised V3.</summary>
    public double V3(Wavevector k1, Wavevector k2, Wavevector k3) => Symmetrised(_y, k1, k2, k3);

    private static double Symmetrised(double[] c, Wavevector k1, Wavevector k2, Wavevector k3) =>
        (Unsymmetrised(c, k1, k2, k3) + Unsymmetrised(c, k2, k3, k1) + Unsymmetrised(c, k3, k1, k2)) / 3.0;

    /// <summary>Σ_s c_s M_s(outer; inner pair), the inner pair already symmetric.</summary>
    private static double Unsymmetrised(double[] c, Wavevector outer, Wavevector a, Wavevector b)
    {
        var pair = a + b;
        if (pair.LengthSquared <= 1e-24 * (a.LengthSquared + b.LengthSquared))
        {
            // Both inner kernels vanish for a + b = 0 (α_s(q, −q) = γ(q, −q) = 0) while the outer ones
            // divide by |a + b|²: the product's limit is zero (momentum conservation).
            return 0.0;
        }

        double alphaSym = ModeCoupling.AlphaSymmetric(a, b);
        double gamma = ModeCoupling.Gamma(a, b);
        double alphaOuter = ModeCoupling.Alpha(outer, pair);
        double alphaInner = ModeCoupling.Alpha(pair, outer);
        double beta = ModeCoupling.Beta(outer, pair);
        double galileon = ModeCoupling.Gamma(outer, pair);
        return c[(int)ThirdOrderStructure.AlphaAlpha] * (alphaOuter + alphaInner) * alphaSym
               + c[(int)ThirdOrderStructure.AlphaGamma] * alphaInner * gamma
               + c[(int)ThirdOrderStructure.AlphaGammaOdd] * alphaOuter * gamma
               + c[(int)ThirdOrderStructure.BetaAlpha] * beta * alphaSym
               + c[(int)ThirdOrderStructure.BetaGamma] * beta * gamma
               + c[(int)ThirdOrderStructure.GammaAlpha] * galileon * alphaSym
               + c[(int)ThirdOrderStructure.GammaGamma] * galileon * gamma;
    }
}
