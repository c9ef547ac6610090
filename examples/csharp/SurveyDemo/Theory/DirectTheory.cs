using Sibyl.Perturbation.Spectra;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Demo.Theory;

/// <summary>
/// The direct one-loop calculation for the cosmologies of a grid spec's box, by the training run's own
/// <see cref="PointCalculator"/>: the same fixed parameters, gravity model, k grid, linear source (fit, Boltzmann
/// solver or the user's program) and linear table range as the emulator's training points, so the two theories
/// differ only by the emulation error.
/// </summary>
public sealed class DirectTheory : ISpectrumTheory
{
    private readonly GridSpec _spec;
    private readonly PointCalculator _calculator;
    private readonly int _redshiftIndex;

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
        _calculator = new PointCalculator(spec);
        _redshiftIndex = spec.Redshifts.Select((z, i) => (z, i)).First(p => Math.Abs(p.z - redshift) < 1e-9).i;
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
        Parallel.For(0, points.Count, options, i => results[i] = Compute(points[i], i, cancellation));
        return Task.FromResult(results);
    }

    /// <summary>One cosmology at this theory's redshift, cut from the calculator's values at every spec redshift.</summary>
    private BasisSpectra Compute(double[] point, int index, CancellationToken cancellation)
    {
        TheoryBox.Check(this, point);
        double[] values = _calculator.Compute(point, index, cancellation);
        int block = _calculator.Layout.Terms.Count * _spec.K.Count;
        return new BasisSpectra(_calculator.Layout, [.. _spec.K], values.AsSpan(_redshiftIndex * block, block).ToArray());
    }
}
