using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.Resummation;
using Sibyl.Perturbation.Spectra;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Matter;

/// <summary>
/// The direct one-loop real-space matter calculation on a fixed k grid:
/// P = P_nw + e^{−k²Σ²}(1 + k²Σ²)P_w + P_1loop[P_nw + e^{−k²Σ²}P_w] − 2 c_s² k² (P_nw + e^{−k²Σ²}P_w)
/// (Baldauf et al. 2015; Blas, Garny, Ivanov &amp; Sibiryakov 2016), with the loop of the damped input taken
/// to first order in the wiggles, P_1loop[P_nw] + e^{−k²Σ²}(P_1loop[P_L] − P_1loop[P_nw]).
/// Momentum integrals depend only on the linear shape, so <see cref="Prepare"/> runs once per linear
/// spectrum and <see cref="Evaluate"/> once per redshift and gravity model sharing it.
/// </summary>
public sealed class OneLoopMatter
{
    private readonly LoopQuadrature _quadrature;

    /// <summary>Builds the cosmology-independent quadrature plan for output wavenumbers <paramref name="k"/> (h/Mpc).</summary>
    /// <param name="k">Output wavenumbers, finite, positive, increasing, a factor 10 inside [qMin, qMax].</param>
    /// <param name="qMin">Lower end of the linear tables the loops integrate over, h/Mpc.</param>
    /// <param name="qMax">Upper end, h/Mpc.</param>
    /// <exception cref="ArgumentException">k or the range is invalid; the message names the value.</exception>
    public OneLoopMatter(double[] k, double qMin = LinearSpectrumFactory.DefaultKMin, double qMax = LinearSpectrumFactory.DefaultKMax)
    {
        ArgumentNullException.ThrowIfNull(k);
        K = (double[])k.Clone();
        _quadrature = new LoopQuadrature(K, qMin, qMax);
    }

    /// <summary>Output wavenumbers, h/Mpc.</summary>
    public double[] K { get; }

    /// <summary>Computes the momentum integrals of a linear spectrum (the expensive, cosmology-dependent step).</summary>
    /// <exception cref="ArgumentException">The spectrum's table does not span the plan's integration range.</exception>
    public PreparedMatterShape Prepare(LinearSpectrum linear)
    {
        ArgumentNullException.ThrowIfNull(linear);
        var full = new MomentumIntegrals(K.Length);
        var noWiggle = new MomentumIntegrals(K.Length);
        _quadrature.Compute(Sample(linear.Shape), Sample(linear.NoWiggleShape), full, noWiggle);
        return new PreparedMatterShape(linear, full, noWiggle, BaoDamping.Sigma2(linear.NoWiggleShape, linear.BaoScale));
    }

    /// <summary>Combines prepared integrals with the time coefficients of one redshift and gravity model.</summary>
    public MatterSpectrum Evaluate(PreparedMatterShape shape, TimeCoefficients time)
    {
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(time);
        int n = K.Length;
        double d = time.D, d2 = d * d;
        double sigma2 = d2 * shape.Sigma2;
        var linear = new double[n];
        var noWiggle = new double[n];
        var treeIr = new double[n];
        var p22 = new double[n];
        var p13 = new double[n];
        var terms = new double[2 * n];
        for (int i = 0; i < n; i++)
        {
            double k = K[i];
            double shapeFull = shape.Linear.Shape.Evaluate(k);
            double shapeNw = shape.Linear.NoWiggleShape.Evaluate(k);
            linear[i] = d2 * shapeFull;
            noWiggle[i] = d2 * shapeNw;
            double wiggle = linear[i] - noWiggle[i];
            double x = k * k * sigma2;
            double damping = Math.Exp(-x);
            treeIr[i] = noWiggle[i] + damping * (1.0 + x) * wiggle;

            double p22Nw = P22(shape.NoWiggle, time, i), p22Full = P22(shape.Full, time, i);
            double p13Nw = P13(shape.NoWiggle, time, i, shapeNw), p13Full = P13(shape.Full, time, i, shapeFull);
            p22[i] = p22Nw + damping * (p22Full - p22Nw);
            p13[i] = p13Nw + damping * (p13Full - p13Nw);

            terms[MatterLayout.TreePlusLoop * n + i] = treeIr[i] + p22[i] + p13[i];
            terms[MatterLayout.Counterterm * n + i] = k * k * (noWiggle[i] + damping * wiggle);
        }

        return new MatterSpectrum(new BasisSpectra(MatterLayout.Layout, (double[])K.Clone(), terms), linear, noWiggle, treeIr, p22, p13, sigma2);
    }

    /// <summary>Prepares and evaluates the model's own linear spectrum at redshift <paramref name="z"/>.</summary>
    public MatterSpectrum Compute(CosmologyModel model, double z)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Compute(Prepare(model.Linear), model, z);
    }

    /// <summary>Evaluates already prepared integrals for <paramref name="model"/> at redshift <paramref name="z"/> (in [0, 20]).</summary>
    public MatterSpectrum Compute(PreparedMatterShape shape, CosmologyModel model, double z)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Evaluate(shape, TimeCoefficientSolver.Solve(model.Background, model.Gravity, 1.0 / (1.0 + z)));
    }

    /// <summary>P_22 = D⁴ J_αα + 2 D² B J_αγ + B² J_γγ, of the shape.</summary>
    private static double P22(MomentumIntegrals j, TimeCoefficients t, int i)
    {
        double d2 = t.D * t.D;
        return d2 * d2 * j[P22Structure.AlphaAlpha][i]
               + 2.0 * d2 * t.B * j[P22Structure.AlphaGamma][i]
               + t.B * t.B * j[P22Structure.GammaGamma][i];
    }

    /// <summary>P_13 = 4 D Shape(k) Σ_s X_s I_s.</summary>
    private static double P13(MomentumIntegrals integrals, TimeCoefficients t, int i, double shapeAtK)
    {
        double sum = 0.0;
        foreach (var s in P13TimeStructures.Pairs)
        {
            sum += t.Density(s.Time) * integrals[s.Loop][i];
        }

        return 4.0 * t.D * shapeAtK * sum;
    }

    private static LogSampledSpectrum Sample(LogGridFunction f) => new(f.Values, f.KMin, f.KMax);
}
