using Sibyl.Perturbation.Spectra;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>The one-loop redshift-space galaxy multipoles at one redshift, as basis terms.</summary>
/// <param name="Basis">Terms in <see cref="GalaxyLayout"/> over k (h/Mpc), in (Mpc/h)³.</param>
/// <param name="Linear">P_L(k, z).</param>
/// <param name="NoWiggle">P_nw(k, z).</param>
/// <param name="GrowthRate">f at z.</param>
/// <param name="Sigma2">Σ²(z), (Mpc/h)².</param>
/// <param name="DeltaSigma2">δΣ²(z), (Mpc/h)².</param>
public sealed record GalaxySpectrum(BasisSpectra Basis, double[] Linear, double[] NoWiggle, double GrowthRate, double Sigma2, double DeltaSigma2)
{
    /// <summary>Multipole ℓ ∈ {0, 2, 4} for nuisance values in <see cref="GalaxyLayout.Nuisance"/> order.</summary>
    /// <exception cref="ArgumentOutOfRangeException">ℓ is not 0, 2 or 4.</exception>
    public double[] Multipole(int ell, ReadOnlySpan<double> nuisance)
    {
        int slot = Multipoles.Slot(ell);
        var result = new double[Linear.Length];
        Basis.Assemble(nuisance, slot, result);
        return result;
    }
}
