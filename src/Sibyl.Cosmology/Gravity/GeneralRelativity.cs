namespace Sibyl.Cosmology.Gravity;

/// <summary>General relativity: μ = 1, no nonlinear vertices (model name <c>lcdm</c>, on any background).</summary>
public sealed class GeneralRelativity : IGravityModel
{
    /// <summary>The single instance.</summary>
    public static GeneralRelativity Instance { get; } = new();

    private GeneralRelativity()
    {
    }

    /// <inheritdoc/>
    public string Name => "lcdm";

    /// <inheritdoc/>
    public double Mu(double a) => 1.0;

    /// <inheritdoc/>
    public double QuadraticVertex(double a) => 0.0;

    /// <inheritdoc/>
    public double CubicVertex(double a) => 0.0;

    /// <inheritdoc/>
    public bool IsGeneralRelativity => true;
}
