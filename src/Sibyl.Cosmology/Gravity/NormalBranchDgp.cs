namespace Sibyl.Cosmology.Gravity;

using Sibyl.Cosmology.Background;

/// <summary>
/// Normal-branch DGP gravity in the quasi-static limit on a ΛCDM background
/// (Koyama, Taruya &amp; Hiramatsu 2009, PRD 79, 123512). The brane-bending mode obeys
/// 3β∇²φ + (r_c²/a²)[(∇²φ)² − (∇_i∇_jφ)²] = 8πG a² ρ̄ δ with Φ = Φ_N + φ/2 and
/// β(a) = 1 + (E/√Ω_rc)(1 + Ḣ/(3H²)), Ω_rc = 1/(4 r_c² H0²). Solving it order by order gives
/// μ = 1 + 1/(3β), γ2 = −Ω_m(a)² E² / (24 Ω_rc β³) and γ3 = Ω_m(a)³ E⁴ / (144 Ω_rc² β⁵)
/// (worked in DEVELOPERS.md, "Gravity models").
/// </summary>
public sealed class NormalBranchDgp : IGravityModel
{
    private readonly ExpansionHistory _background;

    /// <summary>Creates the model.</summary>
    /// <param name="background">Its background; must be ΛCDM (w0 = −1, wa = 0).</param>
    /// <param name="omegaRc">Ω_rc = 1/(4 r_c² H0²) ≥ 0; zero is general relativity.</param>
    /// <exception cref="ArgumentOutOfRangeException">Ω_rc negative or not finite, or the background is not ΛCDM.</exception>
    public NormalBranchDgp(ExpansionHistory background, double omegaRc)
    {
        ArgumentNullException.ThrowIfNull(background);
        if (!double.IsFinite(omegaRc) || omegaRc < 0.0)
        {
            throw new ArgumentOutOfRangeException(nameof(omegaRc), omegaRc, "Omega_rc must be finite and >= 0");
        }

        if (!background.IsCosmologicalConstant)
        {
            throw new ArgumentOutOfRangeException(nameof(background), "the ndgp model lives on a LCDM background: w0 = -1, wa = 0");
        }

        _background = background;
        OmegaRc = omegaRc;
    }

    /// <summary>Ω_rc = 1/(4 r_c² H0²).</summary>
    public double OmegaRc { get; }

    /// <inheritdoc/>
    public string Name => "ndgp";

    /// <inheritdoc/>
    public bool IsGeneralRelativity => OmegaRc == 0.0;

    /// <summary>β(a) = 1 + (E/√Ω_rc)(1 + (d ln H/d ln a)/3); infinite for Ω_rc = 0.</summary>
    public double Beta(double a)
    {
        if (OmegaRc == 0.0)
        {
            return double.PositiveInfinity;
        }

        return 1.0 + _background.Hubble(a) / Math.Sqrt(OmegaRc) * (1.0 + _background.HubbleLogSlope(a) / 3.0);
    }

    /// <inheritdoc/>
    public double Mu(double a) => OmegaRc == 0.0 ? 1.0 : 1.0 + 1.0 / (3.0 * Beta(a));

    /// <inheritdoc/>
    public double QuadraticVertex(double a)
    {
        if (OmegaRc == 0.0)
        {
            return 0.0;
        }

        double beta = Beta(a);
        double omegaM = _background.OmegaMatterAt(a);
        return -omegaM * omegaM * _background.HubbleSquared(a) / (24.0 * OmegaRc * beta * beta * beta);
    }

    /// <inheritdoc/>
    public double CubicVertex(double a)
    {
        if (OmegaRc == 0.0)
        {
            return 0.0;
        }

        double beta = Beta(a);
        double omegaM = _background.OmegaMatterAt(a);
        double e2 = _background.HubbleSquared(a);
        return omegaM * omegaM * omegaM * e2 * e2 / (144.0 * OmegaRc * OmegaRc * Math.Pow(beta, 5));
    }
}
