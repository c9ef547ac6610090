using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.Resummation;
using Sibyl.Perturbation.Spectra;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The direct one-loop redshift-space galaxy calculation on a fixed k grid, multipoles ℓ = 0, 2, 4:
/// P(k, μ) = Z1²[P_nw + e^{−k²Σ²_tot}(1 + k²Σ²_tot)P_w] + L[P_nw] + e^{−k²Σ²_tot}(L[P_L] − L[P_nw]) + counterterms
/// + stochastic terms, with L = P_22 + P_13 by bias monomial and the μ-dependent damping of Ivanov &amp;
/// Sibiryakov (2018, JCAP 07, 053), Σ²_tot(μ) = [1 + fμ²(2 + f)]Σ² + f²μ²(μ² − 1)δΣ².
/// Multipoles by Gauss–Legendre in μ on [0, 1] (<see cref="DefaultMuNodes"/> nodes unless told).
/// </summary>
public sealed class OneLoopGalaxy
{
    /// <summary>
    /// Default Gauss–Legendre nodes in μ ∈ [0, 1]. Loops are polynomials of degree 8 in μ (times L4: 12),
    /// integrated exactly by 7 nodes; the IR damping e^{−k²Σ²_tot(μ)} is not polynomial, and 16 nodes keep the
    /// multipoles within 1e-5 of a 64-node rule up to k = 0.5 h/Mpc at z = 0 (checked in the tests).
    /// </summary>
    public const int DefaultMuNodes = 16;

    private static readonly GalaxyMonomial[] Monomials = Enum.GetValues<GalaxyMonomial>();

    private readonly LoopQuadrature _matter;
    private readonly RedshiftP22Quadrature _p22;
    private readonly RedshiftP13Quadrature _p13;
    private readonly double[] _mu;
    private readonly double[] _muWeights;

    /// <summary>Builds the cosmology-independent plans for output wavenumbers <paramref name="k"/> (h/Mpc).</summary>
    /// <param name="k">Output wavenumbers, increasing, inside [1e-4, 10] h/Mpc.</param>
    /// <param name="muNodes">Gauss–Legendre nodes in μ ∈ [0, 1], at least 7.</param>
    /// <param name="qMin">Lower end of the linear tables the plans integrate over, h/Mpc.</param>
    /// <param name="qMax">Upper end, h/Mpc; every k must lie a factor 10 inside [qMin, qMax].</param>
    /// <exception cref="ArgumentException">k or the range is invalid; the message names the value.</exception>
    public OneLoopGalaxy(double[] k, int muNodes = DefaultMuNodes, double qMin = LinearSpectrumFactory.DefaultKMin, double qMax = LinearSpectrumFactory.DefaultKMax)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(muNodes, 7);
        ArgumentNullException.ThrowIfNull(k);
        K = (double[])k.Clone();
        _matter = new LoopQuadrature(K, qMin, qMax);
        _p22 = new RedshiftP22Quadrature(K, qMin, qMax);
        _p13 = new RedshiftP13Quadrature(K, qMin, qMax);
        var rule = GaussLegendreRule.Create(muNodes);
        _mu = rule.Nodes.Select(x => 0.5 * (x + 1.0)).ToArray();
        _muWeights = rule.Weights.Select(w => 0.5 * w).ToArray();
    }

    /// <summary>Output wavenumbers, h/Mpc.</summary>
    public double[] K { get; }

    /// <summary>Computes the momentum integrals of a linear shape (once per linear spectrum).</summary>
    /// <exception cref="ArgumentException">The shape's table does not span the plans' range.</exception>
    public PreparedGalaxyShape Prepare(LinearSpectrum linear)
    {
        ArgumentNullException.ThrowIfNull(linear);
        var full = Sample(linear.Shape);
        var noWiggle = Sample(linear.NoWiggleShape);
        var matterFull = new MomentumIntegrals(K.Length);
        var matterNw = new MomentumIntegrals(K.Length);
        _matter.Compute(full, noWiggle, matterFull, matterNw);
        var p22Full = new RedshiftP22Integrals(K.Length);
        var p22Nw = new RedshiftP22Integrals(K.Length);
        _p22.Compute(full, noWiggle, p22Full, p22Nw);
        return new PreparedGalaxyShape(
            linear,
            Integrals(full, matterFull, p22Full),
            Integrals(noWiggle, matterNw, p22Nw),
            BaoDamping.Sigma2(linear.NoWiggleShape, linear.BaoScale),
            BaoDamping.DeltaSigma2(linear.NoWiggleShape, linear.BaoScale));
    }

    /// <summary>Combines prepared integrals with the time coefficients of one redshift and model.</summary>
    /// <param name="shape">Prepared integrals.</param>
    /// <param name="time">Time coefficients at the output redshift.</param>
    /// <param name="mappingScale">1 for redshift space; 0 switches the velocity mapping off (real space).</param>
    /// <param name="includeLoops">False keeps only the IR-resummed tree level (for checks against linear theory).</param>
    public GalaxySpectrum Evaluate(PreparedGalaxyShape shape, TimeCoefficients time, double mappingScale = 1.0, bool includeLoops = true)
    {
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(time);
        var t = new RedshiftTimeInputs(time, mappingScale);
        int n = K.Length, terms = GalaxyLayout.Layout.Terms.Count;
        double d2 = time.D * time.D, d4 = d2 * d2;
        double f = t.MappedGrowthRate, sigma2 = d2 * shape.Sigma2, deltaSigma2 = d2 * shape.DeltaSigma2;
        var values = new double[terms * n];
        var linear = new double[n];
        var noWiggle = new double[n];
        var blockFull = new double[MuPolynomials.BlockSize];
        var blockNw = new double[MuPolynomials.BlockSize];
        var atMu = new double[Monomials.Length + 6];
        for (int i = 0; i < n; i++)
        {
            double k = K[i];
            double shapeFull = shape.Linear.Shape.Evaluate(k), shapeNw = shape.Linear.NoWiggleShape.Evaluate(k);
            linear[i] = d2 * shapeFull;
            noWiggle[i] = d2 * shapeNw;
            // The same b2² constant leaves both loops, so it leaves the resummed sum unchanged by the damping.
            double constant = shape.NoWiggle.ConstantB2B2;
            Loop(blockFull, shape.Full, i, k, shapeFull, t, d4, constant);
            Loop(blockNw, shape.NoWiggle, i, k, shapeNw, t, d4, constant);
            double wiggle = linear[i] - noWiggle[i];
            for (int j = 0; j < _mu.Length; j++)
            {
                double mu = _mu[j], mu2 = mu * mu;
                double x = k * k * (((1.0 + (f * mu2 * (2.0 + f))) * sigma2) + (f * f * mu2 * (mu2 - 1.0) * deltaSigma2));
                double damping = Math.Exp(-x);
                double treeIr = noWiggle[i] + (damping * (1.0 + x) * wiggle);
                double leading = noWiggle[i] + (damping * wiggle);
                double fm2 = f * mu2;
                for (int m = 0; m < Monomials.Length; m++)
                {
                    double loopNw = includeLoops ? MuPolynomials.Evaluate(blockNw, Monomials[m], mu2) : 0.0;
                    double loop = includeLoops ? loopNw + (damping * (MuPolynomials.Evaluate(blockFull, Monomials[m], mu2) - loopNw)) : 0.0;
                    double tree = Monomials[m] switch
                    {
                        GalaxyMonomial.B1B1 => treeIr,
                        GalaxyMonomial.B1 => 2.0 * fm2 * treeIr,
                        GalaxyMonomial.One => fm2 * fm2 * treeIr,
                        _ => 0.0,
                    };
                    atMu[m] = tree + loop;
                }

                // −2(c0 + c2 fμ² + c4 f²μ⁴) k² P_IR and −ck4 f⁴μ⁴ k⁴ (b1 + fμ²)² P_IR split by powers of b1.
                double k2 = k * k * leading, fog = fm2 * fm2 * f * f * k * k * k * k * leading;
                atMu[Monomials.Length + 0] = k2;
                atMu[Monomials.Length + 1] = fm2 * k2;
                atMu[Monomials.Length + 2] = fm2 * fm2 * k2;
                atMu[Monomials.Length + 3] = fm2 * fm2 * fog;
                atMu[Monomials.Length + 4] = 2.0 * fm2 * fog;
                atMu[Monomials.Length + 5] = fog;
                for (int l = 0; l < 3; l++)
                {
                    double weight = _muWeights[j] * ((2 * GalaxyLayout.Multipoles[l]) + 1) * Multipoles.Legendre(GalaxyLayout.Multipoles[l], mu);
                    for (int m = 0; m < Monomials.Length; m++)
                    {
                        values[(GalaxyLayout.LoopTerm(Monomials[m], l) * n) + i] += weight * atMu[m];
                    }

                    for (int c = 0; c < 6; c++)
                    {
                        values[((GalaxyLayout.CountertermStart + (3 * c) + l) * n) + i] += weight * atMu[Monomials.Length + c];
                    }
                }
            }

            values[((GalaxyLayout.StochasticStart + 0) * n) + i] = 1.0;
            values[((GalaxyLayout.StochasticStart + 1) * n) + i] = k * k;
            values[((GalaxyLayout.StochasticStart + 2) * n) + i] = k * k / 3.0;
            values[((GalaxyLayout.StochasticStart + 3) * n) + i] = 2.0 * k * k / 3.0;
        }

        return new GalaxySpectrum(new BasisSpectra(GalaxyLayout.Layout, (double[])K.Clone(), values), linear, noWiggle, t.MappedGrowthRate, sigma2, deltaSigma2);
    }

    /// <summary>Prepares and evaluates the model's own linear spectrum at redshift <paramref name="z"/> (in [0, 20]).</summary>
    /// <exception cref="ArgumentException">The model's linear table does not span the plans' range.</exception>
    public GalaxySpectrum Compute(CosmologyModel model, double z)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Evaluate(Prepare(model.Linear), TimeCoefficientSolver.Solve(model.Background, model.Gravity, 1.0 / (1.0 + z)));
    }

    /// <summary>One-loop μ-polynomials at z: every one-loop term is quadratic in the shape, so the shape's integrals scale by D⁴.</summary>
    private static void Loop(double[] block, GalaxySpectrumIntegrals s, int i, double k, double shapeAtK, RedshiftTimeInputs t, double d4, double constantB2B2)
    {
        Array.Clear(block);
        RedshiftP22Terms.Add(block, s.P22, i, t, constantB2B2);
        RedshiftP13Terms.Add(block, s.Matter, s.Displacement, s.SigmaV2, i, k, shapeAtK, t);
        for (int c = 0; c < block.Length; c++)
        {
            block[c] *= d4;
        }
    }

    private GalaxySpectrumIntegrals Integrals(LogSampledSpectrum spectrum, MomentumIntegrals matter, RedshiftP22Integrals p22)
    {
        var displacement = new double[DisplacementKernels.Count * K.Length];
        double sigmaV2 = _p13.Compute(spectrum, displacement);
        return new GalaxySpectrumIntegrals(matter, p22, displacement, sigmaV2, SquaredSpectrumIntegral(spectrum));
    }

    /// <summary>lim_{k→0} 2∫d³q/(2π)³ P(q)P(|k−q|) = (1/π²)∫dq q² P², by Simpson's rule on the table in ln q.</summary>
    private static double SquaredSpectrumIntegral(LogSampledSpectrum spectrum)
    {
        // Simpson needs an odd count; for an even table the last node (q = qMax, where P² is negligible) is left out.
        int n = spectrum.Count - (spectrum.Count % 2 == 0 ? 1 : 0);
        double sum = 0.0;
        for (int i = 0; i < n; i++)
        {
            double q = spectrum.NodeQ(i), p = spectrum.Values[i];
            double simpson = i == 0 || i == n - 1 ? 1.0 : (i % 2 == 1 ? 4.0 : 2.0);
            sum += simpson * q * q * q * p * p;
        }

        return sum * spectrum.LnStep / 3.0 / (Math.PI * Math.PI);
    }

    private static LogSampledSpectrum Sample(LogGridFunction f) => new(f.Values, f.KMin, f.KMax);
}
