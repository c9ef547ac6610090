using Sibyl.Cosmology.Linear;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// Loop integrals of one linear shape (growth units) with and without wiggles, computed once per linear
/// spectrum and reused for every redshift and gravity model that shares it.
/// </summary>
public sealed class PreparedGalaxyShape
{
    internal PreparedGalaxyShape(LinearSpectrum linear, GalaxySpectrumIntegrals full, GalaxySpectrumIntegrals noWiggle, double sigma2, double deltaSigma2)
    {
        Linear = linear;
        Full = full;
        NoWiggle = noWiggle;
        Sigma2 = sigma2;
        DeltaSigma2 = deltaSigma2;
    }

    /// <summary>The linear spectrum.</summary>
    public LinearSpectrum Linear { get; }

    /// <summary>Σ² in (Mpc/h)², growth units (multiply by D² for a redshift).</summary>
    public double Sigma2 { get; }

    /// <summary>δΣ² in (Mpc/h)², growth units.</summary>
    public double DeltaSigma2 { get; }

    internal GalaxySpectrumIntegrals Full { get; }

    internal GalaxySpectrumIntegrals NoWiggle { get; }
}
