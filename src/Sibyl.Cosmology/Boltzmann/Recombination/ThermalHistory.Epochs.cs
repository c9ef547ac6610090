namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>Derived epochs of decoupling and their sound horizons.</summary>
public sealed partial class ThermalHistory
{
    /// <summary>
    /// Photon decoupling redshift z_*, where the Thomson optical depth from today reaches 1. Without
    /// reionisation here; definitions that include τ_reio put z_* a little lower.
    /// </summary>
    public double PhotonDecouplingRedshift { get; }

    /// <summary>
    /// Baryon drag redshift z_drag, where the drag depth τ_d = ∫ κ'/R dτ_conformal from today reaches 1,
    /// R = 3ρ_b / (4ρ_γ) (Hu &amp; Sugiyama 1996, ApJ 471, 542).
    /// </summary>
    public double DragRedshift { get; }

    /// <summary>Comoving sound horizon r_s = ∫₀^τ dτ' / √(3(1 + R)) at <see cref="PhotonDecouplingRedshift"/>, in Mpc.</summary>
    public double SoundHorizonAtDecoupling { get; }

    /// <summary>Comoving sound horizon at <see cref="DragRedshift"/>, in Mpc.</summary>
    public double SoundHorizonAtDrag { get; }

    /// <summary>Redshift where a depth table (decreasing towards today) crosses 1, from its cubic interpolant.</summary>
    private double RedshiftOfUnitDepth(double[] depth)
    {
        int i = _grid.Count - 2;
        while (i > 0 && depth[i] < 1.0)
        {
            i--;
        }

        double early = _grid.LnA(i), late = _grid.LnA(i + 1);
        for (int iteration = 0; iteration < 60; iteration++)
        {
            double middle = 0.5 * (early + late);
            if (_grid.Interpolate(depth, middle) >= 1.0)
            {
                early = middle;
            }
            else
            {
                late = middle;
            }
        }

        return Math.Exp(-0.5 * (early + late)) - 1.0;
    }
}
