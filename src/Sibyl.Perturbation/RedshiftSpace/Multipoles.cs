namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>The Legendre multipoles ℓ = 0, 2, 4 used for redshift-space spectra.</summary>
public static class Multipoles
{
    /// <summary>Slot (0, 1, 2) of multipole ℓ.</summary>
    /// <exception cref="ArgumentOutOfRangeException">ℓ is not 0, 2 or 4.</exception>
    public static int Slot(int ell) => ell switch
    {
        0 => 0,
        2 => 1,
        4 => 2,
        _ => throw new ArgumentOutOfRangeException(nameof(ell), ell, "multipole must be 0, 2 or 4"),
    };

    /// <summary>Legendre polynomial L_ℓ(μ) for ℓ = 0, 2, 4 (Abramowitz &amp; Stegun 22.3).</summary>
    /// <exception cref="ArgumentOutOfRangeException">ℓ is not 0, 2 or 4.</exception>
    public static double Legendre(int ell, double mu)
    {
        double mu2 = mu * mu;
        return Slot(ell) switch
        {
            0 => 1.0,
            1 => 0.5 * ((3.0 * mu2) - 1.0),
            _ => ((35.0 * mu2 * mu2) - (30.0 * mu2) + 3.0) / 8.0,
        };
    }
}
