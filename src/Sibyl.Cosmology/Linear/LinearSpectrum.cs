namespace Sibyl.Cosmology.Linear;

/// <summary>
/// The linear matter spectrum of one cosmology in growth units: P_L(k, a) = D(a)² · Shape(k), where D → a
/// deep in matter domination. Every gravity model sharing the early universe shares this shape, so
/// loop integrals of it are reused for every redshift and model.
/// </summary>
/// <param name="Shape">Shape(k) in (Mpc/h)³, k in h/Mpc.</param>
/// <param name="NoWiggleShape">Its smooth partner from <see cref="NoWiggleSplit"/>.</param>
/// <param name="BaoScale">Sound horizon at the drag epoch in Mpc/h (Eisenstein &amp; Hu 1998, eq. 6).</param>
/// <param name="Source">Where the shape came from, for reports.</param>
public sealed record LinearSpectrum(LogGridFunction Shape, LogGridFunction NoWiggleShape, double BaoScale, string Source)
{
    /// <summary>Smallest k with a value, h/Mpc.</summary>
    public double KMin => Shape.KMin;

    /// <summary>Largest k with a value, h/Mpc.</summary>
    public double KMax => Shape.KMax;
}
