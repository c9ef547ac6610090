namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>Table look-ups: in ln a for the perturbation equations' hot path, in z for everything else.</summary>
public sealed partial class ThermalHistory
{
    /// <summary>
    /// Conformal Thomson scattering rate κ' = a n_e σ_T in 1/Mpc (n_e counts hydrogen and helium electrons).
    /// Before <see cref="LnAStart"/> the fully ionised scaling κ' ∝ a⁻² is used; after a = 1 the value at a = 1.
    /// </summary>
    /// <param name="lnA">ln a.</param>
    public double Opacity(double lnA) =>
        lnA < LnAStart ? _opacity[0] * Math.Exp(-2.0 * (lnA - LnAStart)) : _grid.Interpolate(_opacity, lnA);

    /// <summary>
    /// Baryon sound speed squared c_s² = (k_B T_b / (μ m_H c²)) (1 − (1/3) d ln T_b / d ln a), dimensionless
    /// (c = 1), μ the mean molecular weight in units of m_H counting free electrons (Ma &amp; Bertschinger
    /// 1995, ApJ 455, 7, eq. 68). Before <see cref="LnAStart"/> the scaling c_s² ∝ a⁻¹ of T_b = T_γ is used;
    /// after a = 1 the value at a = 1.
    /// </summary>
    /// <param name="lnA">ln a.</param>
    public double BaryonSoundSpeedSquared(double lnA) =>
        lnA < LnAStart ? _soundSpeedSquared[0] * Math.Exp(LnAStart - lnA) : _grid.Interpolate(_soundSpeedSquared, lnA);

    /// <summary>Free electrons per hydrogen nucleus x_e = n_e / n_H (up to 1 + 2 f_He when helium is doubly ionised).</summary>
    /// <param name="z">Redshift in [0, <see cref="MaximumRedshift"/>].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="z"/> is outside the tables.</exception>
    public double FreeElectronFraction(double z) => _grid.Interpolate(_freeElectrons, LnAOf(z));

    /// <summary>Ionised fraction of hydrogen x_H = n_HII / n_H.</summary>
    /// <param name="z">Redshift in [0, <see cref="MaximumRedshift"/>].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="z"/> is outside the tables.</exception>
    public double IonizedHydrogenFraction(double z) => _grid.Interpolate(_ionizedHydrogen, LnAOf(z));

    /// <summary>Baryon (matter) temperature T_b in K.</summary>
    /// <param name="z">Redshift in [0, <see cref="MaximumRedshift"/>].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="z"/> is outside the tables.</exception>
    public double BaryonTemperature(double z) => _grid.Interpolate(_temperatureRatio, LnAOf(z)) * _cmbTemperature * (1.0 + z);

    /// <summary>
    /// Thomson optical depth τ(z) = ∫ κ' dτ_conformal from the epoch of redshift <paramref name="z"/> to today,
    /// dimensionless, without reionisation.
    /// </summary>
    /// <param name="z">Redshift in [0, <see cref="MaximumRedshift"/>].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="z"/> is outside the tables.</exception>
    public double OpticalDepth(double z) => _grid.Interpolate(_opticalDepth, LnAOf(z));

    /// <summary>
    /// Visibility function in conformal time, g = κ' e^{−τ} in 1/Mpc: the probability density (per Mpc of
    /// conformal time) that a photon seen today last scattered at that epoch; ∫ g dτ_conformal = 1.
    /// </summary>
    /// <param name="z">Redshift in [0, <see cref="MaximumRedshift"/>].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="z"/> is outside the tables.</exception>
    public double Visibility(double z)
    {
        double lnA = LnAOf(z);
        return _grid.Interpolate(_opacity, lnA) * Math.Exp(-_grid.Interpolate(_opticalDepth, lnA));
    }

    private static double LnAOf(double z)
    {
        if (!(z >= 0.0 && z <= MaximumRedshift))
        {
            throw new ArgumentOutOfRangeException(nameof(z), z, $"z must lie in [0, {MaximumRedshift:G6}]");
        }

        return -Math.Log(1.0 + z);
    }
}
