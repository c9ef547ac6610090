using MathNet.Numerics.Interpolation;
using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Growth;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Boltzmann;

/// <summary>
/// The linear spectrum from the built-in Einstein–Boltzmann solver: P(k) = (2π²/k³) A_s (k/k_p)^{n_s−1} (δ_m/ζ)²
/// at z = 0, in growth units like every other source, normalised by ln10As (or rescaled to σ8), and split into
/// wiggle and no-wiggle parts by <see cref="NoWiggleSplit"/>. The solver runs at the wavenumbers of <see cref="Nodes"/>;
/// between them the ratio to the Eisenstein &amp; Hu (1998) spectrum, which is smooth apart from small residual
/// wiggles, is interpolated by a cubic spline in ln k; above the last node the fit continues with the last ratio.
/// </summary>
public static class BoltzmannLinear
{
    /// <summary>Largest wavenumber the solver itself runs at, h/Mpc; above it the fit's shape continues.</summary>
    public const double SolverKMax = 5.0;

    private const double LinearEnd = 0.6;

    /// <summary>Solver wavenumbers (h/Mpc): 6 per decade below 0.008, every 0.006 through the BAO range to 0.6, 20 per decade above.</summary>
    public static IReadOnlyList<double> Nodes { get; } = BuildNodes();

    /// <summary>Solves the Boltzmann hierarchy for <paramref name="parameters"/> and returns the linear spectrum in growth units.</summary>
    /// <param name="parameters">Cosmology.</param>
    /// <param name="lcdmGrowthToday">D(a = 1) of the general-relativity counterpart, in the D → a convention.</param>
    /// <param name="threads">Worker threads for the k modes; 0 for all cores, 1 inside an already parallel training run.</param>
    /// <param name="settings">Accuracy settings; null for the defaults.</param>
    /// <exception cref="ParameterOutOfRangeException">N_eff is outside its range or matter and radiation exceed the critical density.</exception>
    /// <exception cref="ArgumentOutOfRangeException">Y_He is outside (0, 0.5).</exception>
    /// <exception cref="ArithmeticException">A mode failed to integrate.</exception>
    public static LinearSpectrum Compute(CosmologyParameters parameters, double lcdmGrowthToday, int threads = 0, BoltzmannSettings? settings = null)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        // Dark energy reaches the spectrum through the growth factor only, as everywhere in Sibyl: the modes evolve with
        // a cosmological constant of the same Ω_DE and are divided by that universe's growth, so P(k, z) = D(z)² Shape(k)
        // with the model's own smooth-dark-energy D. Evolving them with w ≠ −1 instead would need dark-energy
        // perturbations: without them the Einstein constraints disagree and sub-horizon growth gets a wrong friction term.
        var counterpart = parameters with { W0 = -1.0, Wa = 0.0 };
        double counterpartGrowth = LinearGrowth.Solve(new ExpansionHistory(parameters.OmegaMatter), GeneralRelativity.Instance, 1.0).D;
        var solver = new TransferSolver(new RadiationBackground(counterpart), parameters.HeliumFraction, settings);
        double h = parameters.H;
        var nodes = Nodes;
        var contrast = solver.MatterContrast(nodes.Select(k => k * h).ToArray(), threads);

        // Normalise with A_s = 1e-9 first; ln10As or σ8 fixes the amplitude below.
        var fitShape = LinearSpectrumFactory.FittingFormulaShape(parameters, lcdmGrowthToday);
        double pivot = LinearSpectrumFactory.PivotScale, counterpartGrowthSquared = counterpartGrowth * counterpartGrowth;
        double scalarAmplitude = parameters.Ln10As is { } lnAs ? Math.Exp(lnAs) * 1e-10 : 1e-9;
        var lnK = new double[nodes.Count];
        var lnRatio = new double[nodes.Count];
        for (int i = 0; i < nodes.Count; i++)
        {
            double k = nodes[i] * h;
            double power = 2.0 * Math.PI * Math.PI / (k * k * k) * scalarAmplitude * Math.Pow(k / pivot, parameters.SpectralIndex - 1.0)
                           * contrast[i] * contrast[i] * h * h * h / counterpartGrowthSquared;
            lnK[i] = Math.Log(nodes[i]);
            lnRatio[i] = Math.Log(power / fitShape.Evaluate(nodes[i]));
        }

        var ratio = CubicSpline.InterpolateNatural(lnK, lnRatio);
        double lnKFirst = lnK[0], lnKLast = lnK[^1];
        var shape = LogGridFunction.Sample(
            k => fitShape.Evaluate(k) * Math.Exp(ratio.Interpolate(Math.Clamp(Math.Log(k), lnKFirst, lnKLast))),
            LinearSpectrumFactory.DefaultKMin,
            LinearSpectrumFactory.DefaultKMax,
            LinearSpectrumFactory.GridPoints);
        if (parameters.Ln10As is null)
        {
            shape = LinearSpectrumFactory.ScaledToSigma8(parameters, shape, lcdmGrowthToday);
        }

        return LinearSpectrumFactory.WithNoWiggle(parameters, shape, solver.Thermal.SoundHorizonAtDrag * h, "Boltzmann solver");
    }

    private static double[] BuildNodes()
    {
        var nodes = new List<double>();
        for (double lnK = Math.Log(LinearSpectrumFactory.DefaultKMin); lnK < Math.Log(0.008); lnK += Math.Log(10) / 6)
        {
            nodes.Add(Math.Exp(lnK));
        }

        for (int i = 0; 0.008 + 0.006 * i < LinearEnd; i++)
        {
            nodes.Add(0.008 + 0.006 * i);
        }

        for (double lnK = Math.Log(LinearEnd); lnK <= Math.Log(SolverKMax) + 1e-9; lnK += Math.Log(10) / 20)
        {
            nodes.Add(Math.Exp(lnK));
        }

        return [.. nodes];
    }
}
