using MathNet.Numerics.LinearAlgebra;
using Sibyl.Demo.Survey;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Demo.Likelihood;

/// <summary>
/// The Gaussian likelihood of a multipole data vector with the nuisance parameters split three ways: sampled ones
/// (given per call), linear ones integrated out analytically under Gaussian priors, and the rest fixed at the
/// scenario's hidden values. With the model m = m₀ + A θ linear in the marginalised θ ~ N(μ, S), S diagonal,
/// −2 ln L = rᵀC⁻¹r + μᵀS⁻¹μ − bᵀF⁻¹b + ln det F + const, r = d − m₀, F = AᵀC⁻¹A + S⁻¹, b = AᵀC⁻¹r + S⁻¹μ
/// (the Gaussian integral over θ, done by completing the square).
/// The constant (ln det C, ln det S, 2π factors) is dropped: it does not depend on the theory.
/// </summary>
public sealed class MultipoleLikelihood
{
    private readonly DataVector _data;
    private readonly BasisLayout _layout;
    private readonly double[] _inverseCovariance;
    private readonly double[] _d;
    private readonly int[] _observables;
    private readonly int[] _sampled;
    private readonly int[] _marginalised;
    private readonly double[] _priorMean, _priorPrecision;
    private readonly double[] _fixed;

    /// <summary>Prepares the likelihood of <paramref name="data"/> for spectra of <paramref name="layout"/>.</summary>
    /// <exception cref="ArgumentException">A named parameter is unknown, a multipole is not in the layout, or a marginalised
    /// parameter does not enter the observables linearly (alone, at most once per term).</exception>
    public MultipoleLikelihood(DataVector data, BasisLayout layout, SurveyScenario scenario)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(scenario);
        _data = data;
        _layout = layout;
        _observables = [.. data.Ells.Select(l => IndexOf(layout.Observables, $"P{l}"))];
        _sampled = [.. scenario.SampledNuisance.Select(s => layout.NuisanceIndex(s.Name))];
        _marginalised = [.. scenario.MarginalisedNuisance.Select(m => layout.NuisanceIndex(m.Name))];
        _priorMean = [.. scenario.MarginalisedNuisance.Select(m => m.Mean)];
        _priorPrecision = [.. scenario.MarginalisedNuisance.Select(m => 1.0 / (m.Sigma * m.Sigma))];
        _fixed = [.. layout.Nuisance.Select(n => scenario.HiddenNuisance.TryGetValue(n, out double v) ? v : throw new ArgumentException($"the scenario gives no hidden value of {n}"))];
        if (_sampled.Intersect(_marginalised).Any())
        {
            throw new ArgumentException("a nuisance parameter cannot be both sampled and marginalised");
        }

        foreach (var term in layout.Terms)
        {
            if (term.NuisanceFactors.Count(f => _marginalised.Contains(f)) > 1)
            {
                throw new ArgumentException($"term {term.Name} is not linear in the marginalised parameters");
            }
        }

        _inverseCovariance = Matrix<double>.Build.DenseOfArray(data.Covariance).Cholesky().Solve(Matrix<double>.Build.DenseIdentity(data.Length)).ToRowMajorArray();
        _d = data.Values;
    }

    /// <summary>Names of the sampled nuisance parameters, in the order <see cref="Evaluate"/> expects them.</summary>
    public IReadOnlyList<string> SampledNames => [.. _sampled.Select(i => _layout.Nuisance[i])];

    /// <summary>Names of the marginalised nuisance parameters.</summary>
    public IReadOnlyList<string> MarginalisedNames => [.. _marginalised.Select(i => _layout.Nuisance[i])];

    /// <summary>The likelihood of the data given basis spectra on the data's k grid and the sampled nuisance values.</summary>
    /// <exception cref="ArgumentException">The spectra are on another k grid or the nuisance values are the wrong number.</exception>
    public LikelihoodValue Evaluate(BasisSpectra basis, ReadOnlySpan<double> sampled)
    {
        ArgumentNullException.ThrowIfNull(basis);
        if (sampled.Length != _sampled.Length)
        {
            throw new ArgumentException($"expected {_sampled.Length} sampled nuisance values");
        }

        var nuisance = Nuisance(sampled);

        // Plain arrays rather than a matrix library: the sizes are tiny (n ≈ 50 data, p ≈ 5 parameters), and a library's
        // allocations and internal threading cost more than the arithmetic inside a sampler that is already parallel.
        int n = _data.Length, p = _marginalised.Length;
        var m0 = Model(basis, nuisance);
        var design = new double[p][];
        for (int j = 0; j < p; j++)
        {
            nuisance[_marginalised[j]] = 1.0;
            design[j] = Model(basis, nuisance);
            nuisance[_marginalised[j]] = 0.0;
            for (int i = 0; i < n; i++)
            {
                design[j][i] -= m0[i];
            }
        }

        var r = new double[n];
        for (int i = 0; i < n; i++)
        {
            r[i] = _d[i] - m0[i];
        }

        var cInvR = Multiply(r);
        var cInvA = design.Select(Multiply).ToArray();
        var fisher = new double[p * p];
        var b = new double[p];
        double priorTerm = 0.0;
        for (int j = 0; j < p; j++)
        {
            for (int l = 0; l < p; l++)
            {
                fisher[(j * p) + l] = Dot(design[j], cInvA[l]);
            }

            fisher[(j * p) + j] += _priorPrecision[j];
            b[j] = Dot(design[j], cInvR) + (_priorPrecision[j] * _priorMean[j]);
            priorTerm += _priorPrecision[j] * _priorMean[j] * _priorMean[j];
        }

        double logDetF = SmallCholesky.Factor(fisher, p);
        var mean = (double[])b.Clone();
        SmallCholesky.Solve(fisher, p, mean);
        double minusTwoLnL = Dot(r, cInvR) + priorTerm - Dot(b, mean) + logDetF;

        // χ² of r − A·mean: rᵀC⁻¹r − 2 meanᵀ(AᵀC⁻¹r) + meanᵀ(AᵀC⁻¹A)mean, with the data part of F (prior removed).
        double chi2 = Dot(r, cInvR);
        for (int j = 0; j < p; j++)
        {
            chi2 -= 2.0 * mean[j] * Dot(design[j], cInvR);
            for (int l = 0; l < p; l++)
            {
                chi2 += mean[j] * mean[l] * Dot(design[j], cInvA[l]);
            }
        }

        return new LikelihoodValue(minusTwoLnL, chi2, mean);
    }

    /// <summary>The model vector (data order) for every nuisance value, in the layout's order.</summary>
    public double[] Model(BasisSpectra basis, ReadOnlySpan<double> nuisance)
    {
        ArgumentNullException.ThrowIfNull(basis);
        int nk = _data.K.Length;
        if (basis.K.Length != nk)
        {
            throw new ArgumentException($"spectra on {basis.K.Length} k values, data on {nk}");
        }

        var model = new double[_data.Length];
        for (int s = 0; s < _observables.Length; s++)
        {
            basis.Assemble(nuisance, _observables[s], model.AsSpan(s * nk, nk));
        }

        return model;
    }

    /// <summary>Every nuisance value in layout order: fixed ones, the sampled ones set, the marginalised ones at <paramref name="linear"/> (or 0).</summary>
    public double[] Nuisance(ReadOnlySpan<double> sampled, IReadOnlyList<double>? linear = null)
    {
        var nuisance = (double[])_fixed.Clone();
        for (int i = 0; i < _sampled.Length; i++)
        {
            nuisance[_sampled[i]] = sampled[i];
        }

        for (int p = 0; p < _marginalised.Length; p++)
        {
            nuisance[_marginalised[p]] = linear?[p] ?? 0.0;
        }

        return nuisance;
    }

    private double[] Multiply(double[] x)
    {
        int n = x.Length;
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            y[i] = Dot(_inverseCovariance.AsSpan(i * n, n), x);
        }

        return y;
    }

    private static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double sum = 0.0;
        for (int i = 0; i < a.Length; i++)
        {
            sum += a[i] * b[i];
        }

        return sum;
    }

    private static int IndexOf(IReadOnlyList<string> names, string name)
    {
        for (int i = 0; i < names.Count; i++)
        {
            if (string.Equals(names[i], name, StringComparison.Ordinal))
            {
                return i;
            }
        }

        throw new ArgumentException($"the spectra have no observable {name}");
    }
}
