namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// Physical and atomic constants of the thermal history in SI units. Fundamental constants are CODATA 2018
/// (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010); atomic levels are those of Seager, Sasselov &amp; Scott
/// (2000, ApJS 128, 407), given as wavenumbers as they tabulate them (from memory, agreeing with the NIST
/// atomic spectra tables).
/// </summary>
public static class PhysicalConstants
{
    /// <summary>Speed of light c in m/s (exact).</summary>
    public const double SpeedOfLight = 299792458.0;

    /// <summary>Planck constant h in J s (exact).</summary>
    public const double PlanckConstant = 6.62607015e-34;

    /// <summary>Reduced Planck constant ħ in J s.</summary>
    public const double ReducedPlanckConstant = 1.054571817e-34;

    /// <summary>Boltzmann constant k_B in J/K (exact).</summary>
    public const double BoltzmannConstant = 1.380649e-23;

    /// <summary>Electron volt in J (exact).</summary>
    public const double ElectronVolt = 1.602176634e-19;

    /// <summary>Electron mass m_e in kg.</summary>
    public const double ElectronMass = 9.1093837015e-31;

    /// <summary>Mass of the ¹H atom m_H in kg: 1.00782503 u with u = 1.66053906660e-27 kg.</summary>
    public const double HydrogenMass = 1.6735328e-27;

    /// <summary>Helium-4 to hydrogen atomic mass ratio, 3.9715 as in Seager, Sasselov &amp; Scott (1999).</summary>
    public const double HeliumToHydrogenMass = 3.9715;

    /// <summary>Thomson cross-section σ_T in m².</summary>
    public const double ThomsonCrossSection = 6.6524587321e-29;

    /// <summary>Newtonian constant G in m³ kg⁻¹ s⁻².</summary>
    public const double GravitationalConstant = 6.67430e-11;

    /// <summary>Stefan–Boltzmann constant σ_SB in W m⁻² K⁻⁴.</summary>
    public const double StefanBoltzmann = 5.670374419e-8;

    /// <summary>Radiation constant a_R = 4 σ_SB / c in J m⁻³ K⁻⁴.</summary>
    public const double RadiationDensity = 4.0 * StefanBoltzmann / SpeedOfLight;

    /// <summary>Megaparsec in m (IAU 2015: 1 pc = 648000/π au, 1 au = 149597870700 m).</summary>
    public const double Megaparsec = 3.0856775814913673e22;

    /// <summary>
    /// Ionisation energy of hydrogen from 1s in J: 13.598434 eV. This is the Rydberg energy 13.605693 eV times
    /// the reduced-mass factor 1/(1 + m_e/m_p), the same factor that puts Lyα at 121.567 nm (3/4 of it: hc / 10.1988 eV).
    /// </summary>
    public const double HydrogenIonization = 13.598434 * ElectronVolt;

    /// <summary>Wavelength of hydrogen Lyα (2p → 1s) in m.</summary>
    public const double LymanAlphaWavelength = 121.5670e-9;

    /// <summary>Energy of hydrogen Lyα, the 1s → 2 excitation energy, in J.</summary>
    public const double LymanAlphaEnergy = PlanckConstant * SpeedOfLight / LymanAlphaWavelength;

    /// <summary>Two-photon decay rate of hydrogen 2s → 1s, Λ_H, in s⁻¹.</summary>
    public const double HydrogenTwoPhotonRate = 8.2245809;

    /// <summary>Ionisation energy of neutral helium from 1¹S in J: wavenumber 1.98310772e7 m⁻¹ (24.5874 eV).</summary>
    public const double HeliumIonization = 1.98310772e7 * PlanckConstant * SpeedOfLight;

    /// <summary>Excitation energy of the He I 2¹S level above 1¹S in J: wavenumber 1.66277434e7 m⁻¹ (20.6158 eV).</summary>
    public const double Helium2sEnergy = 1.66277434e7 * PlanckConstant * SpeedOfLight;

    /// <summary>Excitation energy of the He I 2¹P level above 1¹S in J: wavenumber 1.71134891e7 m⁻¹ (21.2180 eV).</summary>
    public const double Helium2pEnergy = 1.71134891e7 * PlanckConstant * SpeedOfLight;

    /// <summary>Wavelength of the He I 2¹P → 1¹S resonance line in m (58.4334 nm).</summary>
    public const double Helium2pWavelength = 1.0 / 1.71134891e7;

    /// <summary>Ionisation energy of He II from 1s in J: wavenumber 4.389088863e7 m⁻¹ (54.4178 eV).</summary>
    public const double HeliumIIIonization = 4.389088863e7 * PlanckConstant * SpeedOfLight;

    /// <summary>Two-photon decay rate of He I 2¹S → 1¹S, Λ_He, in s⁻¹ (Seager, Sasselov &amp; Scott 1999).</summary>
    public const double HeliumTwoPhotonRate = 51.3;
}
