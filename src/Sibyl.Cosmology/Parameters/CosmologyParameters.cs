namespace Sibyl.Cosmology.Parameters;

/// <summary>
/// One point of parameter space. Values are checked by <see cref="ParameterCatalog"/> when built from
/// names; <see cref="CosmologyModel"/> checks them again, so a record made in code cannot slip past.
/// </summary>
public sealed record CosmologyParameters
{
    /// <summary>h = H0 / (100 km/s/Mpc).</summary>
    public double H { get; init; } = 0.6766;

    /// <summary>ω_b = Ω_b h².</summary>
    public double OmegaBaryon { get; init; } = 0.02242;

    /// <summary>ω_cdm = Ω_cdm h².</summary>
    public double OmegaCdm { get; init; } = 0.11933;

    /// <summary>Scalar spectral index n_s.</summary>
    public double SpectralIndex { get; init; } = 0.9665;

    /// <summary>ln(10^10 A_s) at the pivot 0.05/Mpc; when set, <see cref="Sigma8"/> must be null.</summary>
    public double? Ln10As { get; init; }

    /// <summary>σ8 of the general-relativity counterpart at z = 0; used when <see cref="Ln10As"/> is null.</summary>
    public double? Sigma8 { get; init; } = 0.8102;

    /// <summary>CPL w0.</summary>
    public double W0 { get; init; } = -1.0;

    /// <summary>CPL wa.</summary>
    public double Wa { get; init; }

    /// <summary>Gravity model.</summary>
    public GravityKind Gravity { get; init; } = GravityKind.Lcdm;

    /// <summary>nDGP crossover parameter Ω_rc = 1/(4 r_c² H0²).</summary>
    public double OmegaRc { get; init; }

    /// <summary>qs: μ(a=1) − 1.</summary>
    public double Mu0 { get; init; }

    /// <summary>qs: quadratic vertex today.</summary>
    public double Vertex2 { get; init; }

    /// <summary>qs: cubic vertex today.</summary>
    public double Vertex3 { get; init; }

    /// <summary>CMB temperature in K.</summary>
    public double CmbTemperature { get; init; } = 2.7255;

    /// <summary>
    /// Effective number of massless neutrino species; 3.046 is the standard-model value with non-instantaneous
    /// decoupling (Mangano et al. 2005, Nucl. Phys. B 729, 221). Used by the Boltzmann solver only.
    /// </summary>
    public double NEff { get; init; } = 3.046;

    /// <summary>
    /// Primordial helium mass fraction Y_He; 0.2454 is the big-bang-nucleosynthesis value for ω_b ≈ 0.0224
    /// (Planck 2018 VI, from memory). Used by the Boltzmann solver only. It stays fixed: it does not follow ω_b or
    /// N_eff as nucleosynthesis would, so set it with them when varying those.
    /// </summary>
    public double HeliumFraction { get; init; } = 0.2454;

    /// <summary>Ω_m = (ω_b + ω_cdm)/h² (no massive neutrinos).</summary>
    public double OmegaMatter => (OmegaBaryon + OmegaCdm) / (H * H);
}
