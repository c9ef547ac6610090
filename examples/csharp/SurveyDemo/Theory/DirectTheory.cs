using Sibyl.Cosmology;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.Spectra;
using Sibyl.Perturbation.TimeDependence;
using Sibyl.Training.Specs;

namespace Sibyl.Demo.Theory;

/// <summary>
/// The direct one-loop calculation (<see cref="OneLoopGalaxy"/>) for the cosmologies of a grid spec's box: the same
/// fixed parameters, gravity model, k grid and built-in linear source (fit or Boltzmann solver) as the emulator's
/// training points (<see cref="GridPoint.Cosmology"/>), so the two theories differ only by the emulation error.
/// </summary>
public sealed class DirectTheory : ISpectrumTheory
{
    private readonly GridSpec _spec;
    private readonly OneLoopGalaxy _galaxy;

    /// <summary>Builds the cosmology-independent plans for the spec's k grid.</summary>
    /// <param name="spec">A galaxy grid spec at fixed redshifts.</param>
    /// <param name="redshift">One of the spec's redshifts.</param>
    /// <exception cref="ArgumentException">The spec is not a galaxy spec at fixed redshifts, or lacks the redshift.</exception>
    public DirectTheory(GridSpec spec, double redshift)
    {
        ArgumentNullException.ThrowIfNull(spec);
        if (spec.Output != OutputKind.Galaxy || spec.VariesRedshift || !spec.Redshifts.Any(z => Math.Abs(z - redshift) < 1e-9))
        {
            throw new ArgumentException($"the direct theory needs a galaxy spec at fixed redshifts including z = {redshift}", nameof(spec));
        }

        _spec = spec;
        _galaxy = new OneLoopGalaxy([.. spec.K]);
        ParameterNames = [.. spec.Varied.Select(v => v.Name)];
        Min = [.. spec.Varied.Select(v => v.Min)];
        Max = [.. spec.Varied.Select(v => v.Max)];
        Redshift = redshift;
    }

    /// <inheritdoc/>
    public string Description => $"direct one-loop calculation ({_spec.Model}, box of {_spec.Name})";

    /// <inheritdoc/>
    public IReadOnlyList<string> ParameterNames { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> Min { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> Max { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> K => _spec.K;

    /// <inheritdoc/>
    public double Redshift { get; }

    /// <inheritdoc/>
    public Task<BasisSpectra[]> PredictAsync(IReadOnlyList<double[]> points, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(points);
        var results = new BasisSpectra[points.Count];
        var options = new ParallelOptions { CancellationToken = cancellation };
        Parallel.For(0, points.Count, options, i => results[i] = Compute(points[i]));
        return Task.FromResult(results);
    }

    /// <summary>One cosmology: linear spectrum, loop integrals, time coefficients, multipoles (as the training run does).</summary>
    private BasisSpectra Compute(double[] point)
    {
        TheoryBox.Check(this, point);
        // One solver thread per cosmology: the points are already computed in parallel.
        var model = CosmologyModel.Create(GridPoint.Cosmology(_spec, point), _spec.LinearSource, threads: 1);
        var shape = _galaxy.Prepare(model.Linear);
        var time = TimeCoefficientSolver.Solve(model.Background, model.Gravity, 1.0 / (1.0 + Redshift));
        return _galaxy.Evaluate(shape, time).Basis;
    }
}
