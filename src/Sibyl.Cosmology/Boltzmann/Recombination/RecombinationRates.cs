using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// Right-hand sides d/d ln a of the state (n_HI/n_H, n_HeI/n_H, T_b/T_γ) after He III has recombined:
/// the effective three-level hydrogen atom of Peebles (1968, ApJ 153, 1), its He I counterpart and the
/// Compton-coupled matter temperature, all as written by Seager, Sasselov &amp; Scott (1999, ApJ 523, L1;
/// 2000, ApJS 128, 407) with d/dz = −(1/(1+z)) d/d ln a. The neutral fractions are the variables because
/// early on they are ~1e-12 and would be lost in 1 − x_H, which would stall Newton's method in the implicit steps.
/// </summary>
internal sealed class RecombinationRates
{
    /// <summary>8 σ_T a_R / (3 m_e c) in s⁻¹ K⁻⁴: the Compton coupling rate per T_γ⁴.</summary>
    private const double ComptonPerT4 = 8.0 * ThomsonCrossSection * RadiationDensity / (3.0 * ElectronMass * SpeedOfLight);

    /// <summary>λ_Lyα³ / (8π) in m³: the Sobolev escape factor K_H times H.</summary>
    private const double HydrogenEscape = LymanAlphaWavelength * LymanAlphaWavelength * LymanAlphaWavelength / (8.0 * Math.PI);

    /// <summary>λ³ / (8π) of He I 2¹P → 1¹S in m³, K_He times H.</summary>
    private const double HeliumEscape = Helium2pWavelength * Helium2pWavelength * Helium2pWavelength / (8.0 * Math.PI);

    private readonly double _hydrogenDensityToday, _heliumRatio, _cmbTemperature;
    private double _hubble, _hydrogenDensity, _radiationTemperature, _compton;
    private double _temperature = double.NaN, _alpha, _beta, _lymanAlphaBoltzmann;
    private double _alphaHe, _betaHe, _helium2sBoltzmann, _heliumSplittingBoltzmann;

    /// <param name="hydrogenDensityToday">n_H today in m⁻³.</param>
    /// <param name="heliumRatio">f_He = n_He / n_H.</param>
    /// <param name="cmbTemperature">T_γ today in K.</param>
    public RecombinationRates(double hydrogenDensityToday, double heliumRatio, double cmbTemperature)
    {
        _hydrogenDensityToday = hydrogenDensityToday;
        _heliumRatio = heliumRatio;
        _cmbTemperature = cmbTemperature;
    }

    /// <summary>Number of state variables.</summary>
    public const int Dimension = 3;

    /// <summary>Sets the epoch: scale factor <paramref name="a"/> and Hubble rate <paramref name="hubble"/> in s⁻¹.</summary>
    public void SetEpoch(double a, double hubble)
    {
        _hubble = hubble;
        _hydrogenDensity = _hydrogenDensityToday / (a * a * a);
        _radiationTemperature = _cmbTemperature / a;
        double t2 = _radiationTemperature * _radiationTemperature;
        _compton = ComptonPerT4 * t2 * t2;
    }

    /// <summary>Writes d(n_HI/n_H, n_HeI/n_H, T_b/T_γ)/d ln a at the current epoch into <paramref name="derivative"/>.</summary>
    public void Evaluate(ReadOnlySpan<double> state, Span<double> derivative)
    {
        double neutral = state[0], neutralHe = state[1], ratio = state[2];
        double hydrogen = 1.0 - neutral, helium = _heliumRatio - neutralHe;
        double electrons = hydrogen + helium;
        double density = _hydrogenDensity, hubble = _hubble;
        UpdateAtomicRates(ratio * _radiationTemperature);

        // Hydrogen: recombination to n ≥ 2 against photoionisation from n = 2, whose population follows 1s
        // by the Boltzmann factor of Lyα; C is the probability that an n = 2 atom reaches 1s (two-photon
        // decay or redshifted Lyα) before it is photoionised.
        double line = HydrogenEscape / hubble * density * neutral;
        double peebles = (1.0 + HydrogenTwoPhotonRate * line) / (1.0 + (HydrogenTwoPhotonRate + _beta) * line);
        double net = electrons * hydrogen * density * _alpha - _beta * neutral * _lymanAlphaBoltzmann;
        derivative[0] = peebles * net / hubble;

        // He I singlets: the same three-level structure with 2¹S, the 2¹P line escaping by redshift, and
        // 2¹P populated from 2¹S by the Boltzmann factor of their splitting (SSS 1999 eq. 2).
        double lineHe = HeliumEscape / hubble * density * neutralHe * _heliumSplittingBoltzmann;
        double peeblesHe = (1.0 + HeliumTwoPhotonRate * lineHe) / (1.0 + (HeliumTwoPhotonRate + _betaHe) * lineHe);
        double netHe = helium * electrons * density * _alphaHe - _betaHe * neutralHe * _helium2sBoltzmann;
        derivative[1] = peeblesHe * netHe / hubble;

        // Matter temperature: Compton heating by the photons against adiabatic cooling (T_b ∝ a⁻² alone);
        // written for T_b/T_γ, which stays near 1 while the coupling is tight.
        double coupling = _compton * electrons / (1.0 + _heliumRatio + electrons) / hubble;
        derivative[2] = -coupling * (ratio - 1.0) - ratio;
    }

    /// <summary>
    /// Rate coefficients and Boltzmann factors at matter temperature <paramref name="temperature"/> (K), kept
    /// while the temperature is unchanged: the Jacobian's shifts of the neutral fractions and the converged
    /// Newton iterates reuse them, and they are most of the cost of a right-hand side.
    /// </summary>
    private void UpdateAtomicRates(double temperature)
    {
        if (temperature == _temperature)
        {
            return;
        }

        _temperature = temperature;
        double kT = BoltzmannConstant * temperature;
        double phaseSpace = AtomicRates.PhaseSpaceDensity(temperature);
        _alpha = AtomicRates.HydrogenCaseB(temperature);
        _beta = _alpha * phaseSpace * Math.Exp(-(HydrogenIonization - LymanAlphaEnergy) / kT);
        _lymanAlphaBoltzmann = Math.Exp(-LymanAlphaEnergy / kT);
        _alphaHe = AtomicRates.HeliumSinglet(temperature);
        _betaHe = 4.0 * _alphaHe * phaseSpace * Math.Exp(-(HeliumIonization - Helium2sEnergy) / kT);
        _helium2sBoltzmann = Math.Exp(-Helium2sEnergy / kT);
        _heliumSplittingBoltzmann = Math.Exp(-(Helium2pEnergy - Helium2sEnergy) / kT);
    }
}
