using System.Globalization;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Boltzmann;

/// <summary>
/// The flat background of the Boltzmann solver: photons, massless neutrinos, baryons, cold dark matter and a
/// dark-energy fluid with w(a) = w0 + wa (1 − a), radiation included at all times. Lengths are in Mpc and
/// rates in 1/Mpc (c = 1); the dark-energy density absorbs the radiation so that the universe stays flat.
/// </summary>
public sealed class RadiationBackground
{
    /// <summary>Speed of light in km/s.</summary>
    public const double SpeedOfLight = 299792.458;

    /// <summary>
    /// ω_γ per (T_CMB / 2.7255 K)⁴: ρ_γ = a_rad T⁴ / c² over the critical density 3 (100 km/s/Mpc)² / (8πG),
    /// with a_rad = π² k_B⁴ / (15 ħ³ c³) = 7.565733e-16 J m⁻³ K⁻⁴ and G = 6.67430e-11 m³ kg⁻¹ s⁻² (CODATA 2018),
    /// which give ρ_crit = 1.878342e-26 h² kg m⁻³ and ω_γ = 2.472975e-5.
    /// </summary>
    public const double PhotonDensityAt2725 = 2.472975e-5;

    /// <summary>Energy density of one massless neutrino species per photon density: (7/8)(4/11)^{4/3}.</summary>
    public static readonly double NeutrinoPerPhoton = 7.0 / 8.0 * Math.Pow(4.0 / 11.0, 4.0 / 3.0);

    /// <summary>Builds the background of <paramref name="parameters"/>.</summary>
    /// <exception cref="ParameterOutOfRangeException">N_eff is outside [0, 10] or matter and radiation leave no room for dark energy.</exception>
    public RadiationBackground(CosmologyParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        if (!(parameters.NEff >= 0.0 && parameters.NEff <= 10.0))
        {
            throw new ParameterOutOfRangeException("N_eff", string.Create(CultureInfo.InvariantCulture, $"must lie in [0, 10], got {parameters.NEff:G}"));
        }

        double h2 = parameters.H * parameters.H;
        double t = parameters.CmbTemperature / 2.7255;
        HubbleToday = parameters.H * 100.0 / SpeedOfLight;
        OmegaPhoton = PhotonDensityAt2725 * t * t * t * t / h2;
        OmegaNeutrino = parameters.NEff * NeutrinoPerPhoton * OmegaPhoton;
        OmegaBaryon = parameters.OmegaBaryon / h2;
        OmegaCdm = parameters.OmegaCdm / h2;
        OmegaDarkEnergy = 1.0 - OmegaPhoton - OmegaNeutrino - OmegaBaryon - OmegaCdm;
        if (!(OmegaDarkEnergy >= 0.0))
        {
            throw new ParameterOutOfRangeException(
                "omega_cdm",
                string.Create(CultureInfo.InvariantCulture, $"matter and radiation exceed the critical density (Omega_m + Omega_r = {1.0 - OmegaDarkEnergy:G6}); the solver's flat universe needs room for both"));
        }

        W0 = parameters.W0;
        Wa = parameters.Wa;
        CmbTemperature = parameters.CmbTemperature;
    }

    /// <summary>H0 in 1/Mpc.</summary>
    public double HubbleToday { get; }

    /// <summary>Ω_γ today.</summary>
    public double OmegaPhoton { get; }

    /// <summary>Ω_ν today, all massless species together.</summary>
    public double OmegaNeutrino { get; }

    /// <summary>Ω_b today.</summary>
    public double OmegaBaryon { get; }

    /// <summary>Ω_cdm today.</summary>
    public double OmegaCdm { get; }

    /// <summary>Ω_DE today, closing the budget.</summary>
    public double OmegaDarkEnergy { get; }

    /// <summary>CPL w0.</summary>
    public double W0 { get; }

    /// <summary>CPL wa.</summary>
    public double Wa { get; }

    /// <summary>T_CMB today in K.</summary>
    public double CmbTemperature { get; }

    /// <summary>Ω_γ + Ω_ν today.</summary>
    public double OmegaRadiation => OmegaPhoton + OmegaNeutrino;

    /// <summary>Ω_b + Ω_cdm today.</summary>
    public double OmegaMatter => OmegaBaryon + OmegaCdm;

    /// <summary>Fraction of the radiation density in neutrinos, R_ν of Ma &amp; Bertschinger (1995).</summary>
    public double NeutrinoFraction => OmegaNeutrino / OmegaRadiation;

    /// <summary>Dark-energy density over today's critical density at scale factor <paramref name="a"/>.</summary>
    public double DarkEnergyDensity(double a) =>
        OmegaDarkEnergy * Math.Exp(-3.0 * (1.0 + W0 + Wa) * Math.Log(a) - 3.0 * Wa * (1.0 - a));

    /// <summary>Dark-energy equation of state w(a).</summary>
    public double DarkEnergyEquationOfState(double a) => W0 + Wa * (1.0 - a);

    /// <summary>E²(a) = H²/H0².</summary>
    public double HubbleSquaredOverToday(double a)
    {
        double a2 = a * a;
        return OmegaRadiation / (a2 * a2) + OmegaMatter / (a2 * a) + DarkEnergyDensity(a);
    }

    /// <summary>Conformal Hubble rate 𝓗 = a H in 1/Mpc.</summary>
    public double ConformalHubble(double a) => a * HubbleToday * Math.Sqrt(HubbleSquaredOverToday(a));

    /// <summary>
    /// d𝓗/dτ in 1/Mpc²: 𝓗' = −(𝓗²/2)(1 + 3 p/ρ) over all components, from the second Friedmann equation.
    /// </summary>
    public double ConformalHubbleDerivative(double a)
    {
        double a2 = a * a;
        double radiation = OmegaRadiation / (a2 * a2), matter = OmegaMatter / (a2 * a), darkEnergy = DarkEnergyDensity(a);
        double total = radiation + matter + darkEnergy;
        double pressure = radiation / 3.0 + DarkEnergyEquationOfState(a) * darkEnergy;
        double conformalHubbleSquared = a2 * HubbleToday * HubbleToday * total;
        return -0.5 * conformalHubbleSquared * (1.0 + 3.0 * pressure / total);
    }
}
