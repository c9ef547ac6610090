using System.Diagnostics;
using Sibyl.Demo.Sampling;
using Sibyl.Demo.Survey;
using Sibyl.Demo.Theory;

namespace Sibyl.Demo.Likelihood;

/// <summary>
/// The posterior the demo samples: the theory's cosmological parameters, then the sampled nuisance parameters, under
/// flat priors (the theory's box and the scenario's ranges), times the likelihood with the linear nuisance parameters
/// marginalised. Proposals outside the priors get ln p = −∞ without calling the theory, so the emulator never sees a
/// point outside its box. Whole batches go to the theory at once.
/// </summary>
public sealed class SurveyPosterior : IBatchLogDensity
{
    private readonly ISpectrumTheory _theory;
    private readonly MultipoleLikelihood _likelihood;
    private readonly SampledNuisance[] _nuisance;

    /// <summary>Joins a theory, a likelihood and the scenario's priors.</summary>
    /// <exception cref="ArgumentException">The theory's k grid or redshift differs from the data's.</exception>
    public SurveyPosterior(ISpectrumTheory theory, MultipoleLikelihood likelihood, SurveyScenario scenario, IReadOnlyList<double> dataK)
    {
        ArgumentNullException.ThrowIfNull(theory);
        ArgumentNullException.ThrowIfNull(likelihood);
        ArgumentNullException.ThrowIfNull(scenario);
        ArgumentNullException.ThrowIfNull(dataK);
        if (theory.K.Count != dataK.Count || theory.K.Zip(dataK).Any(p => Math.Abs(p.First - p.Second) > 1e-9 * p.Second))
        {
            throw new ArgumentException("the theory's k grid differs from the data's bin centres; train the emulator on the data's k values");
        }

        if (Math.Abs(theory.Redshift - scenario.Redshift) > 1e-9)
        {
            throw new ArgumentException("the theory's redshift differs from the scenario's");
        }

        _theory = theory;
        _likelihood = likelihood;
        _nuisance = scenario.SampledNuisance;
        Names = [.. theory.ParameterNames, .. scenario.SampledNuisance.Select(s => s.Name)];
    }

    /// <summary>Parameter names in sampling order.</summary>
    public IReadOnlyList<string> Names { get; }

    /// <inheritdoc/>
    public int Dimension => Names.Count;

    /// <summary>Theory evaluations so far (points inside the priors).</summary>
    public long Evaluations { get; private set; }

    /// <summary>Wall-clock time spent in the theory so far (the rest of a likelihood is the linear algebra).</summary>
    public TimeSpan TheoryTime { get; private set; }

    /// <summary>Lower edges of the flat priors, in sampling order.</summary>
    public double[] Min => [.. _theory.Min, .. _nuisance.Select(n => n.Min)];

    /// <summary>Upper edges of the flat priors, in sampling order.</summary>
    public double[] Max => [.. _theory.Max, .. _nuisance.Select(n => n.Max)];

    /// <inheritdoc/>
    public void Evaluate(IReadOnlyList<double[]> points, Span<double> logDensity)
    {
        ArgumentNullException.ThrowIfNull(points);
        var inside = new List<int>();
        for (int i = 0; i < points.Count; i++)
        {
            logDensity[i] = double.NegativeInfinity;
            if (InPrior(points[i]))
            {
                inside.Add(i);
            }
        }

        if (inside.Count == 0)
        {
            return;
        }

        var values = Likelihoods([.. inside.Select(i => points[i])]);
        for (int j = 0; j < inside.Count; j++)
        {
            logDensity[inside[j]] = -0.5 * values[j].MinusTwoLnL;
        }
    }

    /// <summary>The likelihood of each point (all inside the priors), the theory called once for the batch.</summary>
    public LikelihoodValue[] Likelihoods(IReadOnlyList<double[]> points)
    {
        ArgumentNullException.ThrowIfNull(points);
        int d = _theory.ParameterNames.Count;
        long start = Stopwatch.GetTimestamp();
        var spectra = _theory.PredictAsync([.. points.Select(p => p[..d])]).GetAwaiter().GetResult();
        TheoryTime += Stopwatch.GetElapsedTime(start);
        Evaluations += points.Count;
        // The linear algebra of each point is independent (and the likelihood keeps no state), so it runs on all cores too.
        var values = new LikelihoodValue[points.Count];
        Parallel.For(0, points.Count, j => values[j] = _likelihood.Evaluate(spectra[j], points[j].AsSpan(d)));
        return values;
    }

    /// <summary>True inside every flat prior.</summary>
    public bool InPrior(ReadOnlySpan<double> point)
    {
        int d = _theory.ParameterNames.Count;
        if (point.Length != Dimension || !TheoryBox.Contains(_theory, point[..d]))
        {
            return false;
        }

        for (int i = 0; i < _nuisance.Length; i++)
        {
            if (!(point[d + i] >= _nuisance[i].Min && point[d + i] <= _nuisance[i].Max))
            {
                return false;
            }
        }

        return true;
    }
}
