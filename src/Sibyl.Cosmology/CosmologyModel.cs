using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Growth;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology;

/// <summary>
/// One cosmology: background, gravity model and normalised linear spectrum. Modified-gravity models share
/// the early universe of their general-relativity counterpart on the same background, so their linear
/// spectrum is that counterpart's rescaled by (D_model/D_GR)² at the output redshift.
/// </summary>
public sealed class CosmologyModel
{
    private CosmologyModel(CosmologyParameters parameters, ExpansionHistory background, IGravityModel gravity, double lcdmGrowthToday, LinearSpectrum linear)
    {
        Parameters = parameters;
        Background = background;
        Gravity = gravity;
        LcdmGrowthToday = lcdmGrowthToday;
        Linear = linear;
    }

    /// <summary>The parameters this model was built from.</summary>
    public CosmologyParameters Parameters { get; }

    /// <summary>Expansion history.</summary>
    public ExpansionHistory Background { get; }

    /// <summary>Gravity model.</summary>
    public IGravityModel Gravity { get; }

    /// <summary>D(a = 1) of the general-relativity counterpart, with D → a early.</summary>
    public double LcdmGrowthToday { get; }

    /// <summary>Linear spectrum shape and its no-wiggle partner (growth units).</summary>
    public LinearSpectrum Linear { get; }

    /// <summary>Builds the model with a built-in linear spectrum: the Eisenstein &amp; Hu (1998) fit unless told otherwise.</summary>
    /// <param name="parameters">Cosmology.</param>
    /// <param name="source">Where the linear spectrum comes from; <see cref="LinearSource.Boltzmann"/> takes 0.15–0.35 s on 2 cores.</param>
    /// <param name="threads">
    /// Threads of the Boltzmann solver: 0 (default) for every core, 1 inside a run that is already parallel over
    /// cosmologies. The fit ignores it.
    /// </param>
    /// <exception cref="ParameterOutOfRangeException">A parameter is out of range.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="threads"/> is negative or <paramref name="source"/> unknown.</exception>
    public static CosmologyModel Create(CosmologyParameters parameters, LinearSource source = LinearSource.Fit, int threads = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(threads);
        var (background, gravity, growthToday) = Dynamics(parameters);
        var linear = source switch
        {
            LinearSource.Fit => LinearSpectrumFactory.FromFittingFormula(parameters, growthToday),
            LinearSource.Boltzmann => BoltzmannLinear.Compute(parameters, growthToday, threads),
            _ => throw new ArgumentOutOfRangeException(nameof(source), source, "unknown linear source"),
        };
        return new CosmologyModel(parameters, background, gravity, growthToday, linear);
    }

    /// <summary>
    /// Builds the model with a user's table of the general-relativity P_L(k, z = 0), k in h/Mpc, resampled over the
    /// part of it inside [<paramref name="rangeMin"/>, <paramref name="rangeMax"/>].
    /// </summary>
    /// <exception cref="ParameterOutOfRangeException">A parameter is out of range.</exception>
    /// <exception cref="ArgumentException">The table is invalid.</exception>
    public static CosmologyModel CreateFromTable(
        CosmologyParameters parameters,
        IReadOnlyList<double> k,
        IReadOnlyList<double> power,
        double rangeMin = LinearSpectrumFactory.DefaultKMin,
        double rangeMax = LinearSpectrumFactory.DefaultKMax)
    {
        var (background, gravity, growthToday) = Dynamics(parameters);
        return new CosmologyModel(parameters, background, gravity, growthToday, LinearSpectrumFactory.FromTable(parameters, k, power, growthToday, rangeMin, rangeMax));
    }

    /// <summary>Growth of this model at redshift <paramref name="z"/>.</summary>
    public GrowthState Growth(double z) => LinearGrowth.SolveAtRedshift(Background, Gravity, z);

    /// <summary>Linear power P_L(k, z) = D(z)² Shape(k) in (Mpc/h)³; k in h/Mpc inside the table.</summary>
    public double LinearPower(double k, double z)
    {
        double d = Growth(z).D;
        return d * d * Linear.Shape.Evaluate(k);
    }

    /// <summary>σ8 of this model at redshift <paramref name="z"/>.</summary>
    public double Sigma8(double z) => Growth(z).D * Math.Sqrt(TopHat.Variance(Linear.Shape, 8.0));

    private static (ExpansionHistory, IGravityModel, double) Dynamics(CosmologyParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ParameterCatalog.Validate(parameters);
        var background = new ExpansionHistory(parameters.OmegaMatter, parameters.W0, parameters.Wa);
        IGravityModel gravity = parameters.Gravity switch
        {
            GravityKind.Lcdm => GeneralRelativity.Instance,
            GravityKind.Ndgp => new NormalBranchDgp(background, parameters.OmegaRc),
            GravityKind.QuasiStatic => new QuasiStaticModification(background, parameters.Mu0, parameters.Vertex2, parameters.Vertex3),
            _ => throw new ArgumentOutOfRangeException(nameof(parameters), parameters.Gravity, "unknown gravity model"),
        };
        double growthToday = LinearGrowth.Solve(background, GeneralRelativity.Instance, 1.0).D;
        return (background, gravity, growthToday);
    }
}
