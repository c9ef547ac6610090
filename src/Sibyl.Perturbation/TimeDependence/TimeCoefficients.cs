namespace Sibyl.Perturbation.TimeDependence;

/// <summary>
/// Exact time dependence of the perturbative kernels at one scale factor, with D → a deep in matter
/// domination and ' = d/d ln a. Second order: F2 = D² alpha_s + B gamma, G2 = D D' alpha_s + B' gamma
/// (velocity Θ = −∇·v/ℋ, so G = f F at linear order). Third order: F3 = Σ_s X_s M_s and G3 = Σ_s Y_s M_s
/// over <see cref="ThirdOrderStructure"/>. Einstein–de Sitter: D = a, B = −(2/7)a², X_AlphaAlpha = (7/18)a³,
/// X_AlphaGamma = −(2/9)a³, X_BetaAlpha = (2/9)a³, X_BetaGamma = −(8/63)a³, X_AlphaGammaOdd = −(1/9)a³.
/// </summary>
public sealed class TimeCoefficients
{
    private readonly double[] _density;
    private readonly double[] _velocity;

    internal TimeCoefficients(double scaleFactor, double d, double dPrime, double b, double bPrime, double[] density, double[] velocity)
    {
        ScaleFactor = scaleFactor;
        D = d;
        DPrime = dPrime;
        B = b;
        BPrime = bPrime;
        _density = density;
        _velocity = velocity;
    }

    /// <summary>Scale factor a.</summary>
    public double ScaleFactor { get; }

    /// <summary>Linear growth D.</summary>
    public double D { get; }

    /// <summary>dD/d ln a.</summary>
    public double DPrime { get; }

    /// <summary>Growth rate f = D'/D.</summary>
    public double F => DPrime / D;

    /// <summary>Second-order coefficient of gamma in F2.</summary>
    public double B { get; }

    /// <summary>dB/d ln a, the coefficient of gamma in G2.</summary>
    public double BPrime { get; }

    /// <summary>Third-order density coefficient X_s.</summary>
    public double Density(ThirdOrderStructure structure) => _density[(int)structure];

    /// <summary>Third-order velocity coefficient Y_s.</summary>
    public double Velocity(ThirdOrderStructure structure) => _velocity[(int)structure];

    /// <summary>
    /// The same kernel shapes at a different amplitude: D, D' times <paramref name="scale"/>, B, B' times its
    /// square and third order times its cube — how EdS kernels are used with a ΛCDM growth factor.
    /// </summary>
    internal static TimeCoefficients Scaled(TimeCoefficients c, double scale)
    {
        double s2 = scale * scale, s3 = s2 * scale;
        return new TimeCoefficients(
            c.ScaleFactor, c.D * scale, c.DPrime * scale, c.B * s2, c.BPrime * s2,
            c._density.Select(x => x * s3).ToArray(), c._velocity.Select(x => x * s3).ToArray());
    }
}
