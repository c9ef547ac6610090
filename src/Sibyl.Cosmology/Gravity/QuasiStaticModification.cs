namespace Sibyl.Cosmology.Gravity;

using Sibyl.Cosmology.Background;

/// <summary>
/// A generic quasi-static modification (model name <c>qs</c>) whose departures from general relativity
/// follow the dark-energy fraction, so they vanish in matter domination and are set by their values today:
/// μ(a) = 1 + mu0 · Ω_DE(a)/Ω_DE, γ2(a) = vertex2 · Ω_DE(a)/Ω_DE, γ3(a) = vertex3 · Ω_DE(a)/Ω_DE.
/// The vertices have the Galileon structure of <see cref="IGravityModel"/>; nDGP today has
/// vertex2 ≈ −Ω_m² / (24 Ω_rc β0³), for scale.
/// </summary>
public sealed class QuasiStaticModification : IGravityModel
{
    private readonly ExpansionHistory _background;

    /// <summary>Creates the model.</summary>
    /// <param name="background">Background whose Ω_DE(a) sets the time dependence.</param>
    /// <param name="mu0">μ(a=1) − 1, in (−1, 10]; μ must stay positive.</param>
    /// <param name="vertex2">γ2 today, finite.</param>
    /// <param name="vertex3">γ3 today, finite.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its range.</exception>
    public QuasiStaticModification(ExpansionHistory background, double mu0, double vertex2, double vertex3)
    {
        ArgumentNullException.ThrowIfNull(background);
        if (!(mu0 > -1.0 && mu0 <= 10.0))
        {
            throw new ArgumentOutOfRangeException(nameof(mu0), mu0, "mu0 must lie in (-1, 10]");
        }

        if (!double.IsFinite(vertex2))
        {
            throw new ArgumentOutOfRangeException(nameof(vertex2), vertex2, "vertex2 must be finite");
        }

        if (!double.IsFinite(vertex3))
        {
            throw new ArgumentOutOfRangeException(nameof(vertex3), vertex3, "vertex3 must be finite");
        }

        _background = background;
        Mu0 = mu0;
        Vertex2 = vertex2;
        Vertex3 = vertex3;
    }

    /// <summary>μ today minus one.</summary>
    public double Mu0 { get; }

    /// <summary>γ2 today.</summary>
    public double Vertex2 { get; }

    /// <summary>γ3 today.</summary>
    public double Vertex3 { get; }

    /// <inheritdoc/>
    public string Name => "qs";

    /// <inheritdoc/>
    public bool IsGeneralRelativity => Mu0 == 0.0 && Vertex2 == 0.0 && Vertex3 == 0.0;

    /// <inheritdoc/>
    public double Mu(double a) => 1.0 + Mu0 * DarkEnergyWeight(a);

    /// <inheritdoc/>
    public double QuadraticVertex(double a) => Vertex2 * DarkEnergyWeight(a);

    /// <inheritdoc/>
    public double CubicVertex(double a) => Vertex3 * DarkEnergyWeight(a);

    private double DarkEnergyWeight(double a) => _background.OmegaDarkEnergyAt(a) / _background.OmegaDarkEnergy;
}
