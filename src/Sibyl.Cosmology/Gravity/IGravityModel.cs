namespace Sibyl.Cosmology.Gravity;

/// <summary>
/// A theory of gravity in the quasi-static limit, seen by matter through a modified Poisson equation
/// ∇²Φ/ℋ² = (3/2) Ω_m(a) μ(a) δ + γ2(a) 𝒩[δ, δ] + γ3(a) 𝒩[δ, 𝒩[δ, δ]],
/// where 𝒩[A, B](k) = ∫ (1 − μ12²) A(k1) B(k2) is the Galileon-type mode coupling.
/// Growth is scale independent: μ depends on time only.
/// </summary>
public interface IGravityModel
{
    /// <summary>Short name used on the command line: lcdm, ndgp or qs.</summary>
    string Name { get; }

    /// <summary>Linear effective-gravitational-constant ratio μ(a) = G_eff/G.</summary>
    double Mu(double a);

    /// <summary>Quadratic vertex γ2(a) multiplying 𝒩[δ, δ] in ∇²Φ/ℋ²; zero in general relativity.</summary>
    double QuadraticVertex(double a);

    /// <summary>Cubic vertex γ3(a) multiplying 𝒩[δ, 𝒩[δ, δ]] in ∇²Φ/ℋ²; zero in general relativity.</summary>
    double CubicVertex(double a);

    /// <summary>True when μ = 1 and both vertices vanish at all times.</summary>
    bool IsGeneralRelativity { get; }
}
