namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>
/// Where each variable of one k mode sits in the state vector: η, δ_c, δ_b, θ_b, δ_γ, θ_γ, F_γ2…F_γℓmax,
/// G_γ0…G_γℓmax', δ_ν, θ_ν, F_ν2…F_νℓmax'' (Ma &amp; Bertschinger 1995, synchronous gauge, §4–5).
/// </summary>
public sealed class ModeLayout
{
    /// <summary>Metric η.</summary>
    public const int Eta = 0;

    /// <summary>CDM density contrast.</summary>
    public const int DeltaCdm = 1;

    /// <summary>Baryon density contrast.</summary>
    public const int DeltaBaryon = 2;

    /// <summary>Baryon velocity divergence θ_b, 1/Mpc.</summary>
    public const int ThetaBaryon = 3;

    /// <summary>Photon density contrast.</summary>
    public const int DeltaPhoton = 4;

    /// <summary>Photon velocity divergence θ_γ, 1/Mpc.</summary>
    public const int ThetaPhoton = 5;

    /// <summary>F_γ2, the first photon multipole above the fluid ones.</summary>
    public const int PhotonQuadrupole = 6;

    /// <summary>Lays out hierarchies truncated at the given multipoles.</summary>
    public ModeLayout(int photonMultipoles, int polarizationMultipoles, int neutrinoMultipoles)
    {
        PhotonMultipoles = photonMultipoles;
        PolarizationMultipoles = polarizationMultipoles;
        NeutrinoMultipoles = neutrinoMultipoles;
        Polarization = PhotonQuadrupole + photonMultipoles - 1;
        DeltaNeutrino = Polarization + polarizationMultipoles + 1;
        ThetaNeutrino = DeltaNeutrino + 1;
        NeutrinoQuadrupole = DeltaNeutrino + 2;
        Dimension = NeutrinoQuadrupole + neutrinoMultipoles - 1;
    }

    /// <summary>The layout of the hierarchies <paramref name="settings"/> ask for.</summary>
    public static ModeLayout For(BoltzmannSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return new ModeLayout(settings.PhotonMultipoles, settings.PolarizationMultipoles, settings.NeutrinoMultipoles);
    }

    /// <summary>Photon ℓmax.</summary>
    public int PhotonMultipoles { get; }

    /// <summary>Polarisation ℓmax.</summary>
    public int PolarizationMultipoles { get; }

    /// <summary>Neutrino ℓmax.</summary>
    public int NeutrinoMultipoles { get; }

    /// <summary>Index of G_γ0.</summary>
    public int Polarization { get; }

    /// <summary>Index of δ_ν.</summary>
    public int DeltaNeutrino { get; }

    /// <summary>Index of θ_ν.</summary>
    public int ThetaNeutrino { get; }

    /// <summary>Index of F_ν2.</summary>
    public int NeutrinoQuadrupole { get; }

    /// <summary>Length of the state vector.</summary>
    public int Dimension { get; }

    /// <summary>Index of photon multipole F_γℓ, ℓ ≥ 2.</summary>
    public int Photon(int l) => PhotonQuadrupole + l - 2;
}
