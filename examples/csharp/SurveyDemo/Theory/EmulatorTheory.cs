using Sibyl.Emulation.Emulators;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Demo.Theory;

/// <summary>
/// An emulator file in this process: one <see cref="EmulatorPredictor"/> per thread (they own their buffers), each
/// prediction copied out so the caller may keep it. The emulator refuses points outside its box.
/// </summary>
public sealed class EmulatorTheory : ISpectrumTheory, IDisposable
{
    /// <summary>Below this many points a batch runs on the calling thread: a prediction is far cheaper than a task.</summary>
    private const int ParallelBatch = 8;

    private readonly SpectrumEmulator _emulator;
    private readonly ThreadLocal<EmulatorPredictor> _predictors;
    private readonly int _slice;
    private readonly double[] _k;

    /// <summary>Uses the slice of <paramref name="redshift"/> of <paramref name="emulator"/>.</summary>
    /// <param name="emulator">A loaded emulator of the galaxy basis.</param>
    /// <param name="source">Names the emulator in descriptions (for example its file name).</param>
    /// <param name="redshift">One of the emulator's redshift slices.</param>
    /// <exception cref="Cosmology.Parameters.ParameterOutOfRangeException">The emulator has no slice at that redshift.</exception>
    public EmulatorTheory(SpectrumEmulator emulator, string source, double redshift)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        _emulator = emulator;
        _slice = emulator.SliceOf(redshift);
        _predictors = new ThreadLocal<EmulatorPredictor>(emulator.CreatePredictor);
        _k = [.. emulator.K];
        Description = $"emulator {source} ({emulator.TrainingCount} training points)";
        Redshift = redshift;
    }

    /// <summary>The emulator behind this theory.</summary>
    public SpectrumEmulator Emulator => _emulator;

    /// <inheritdoc/>
    public string Description { get; }

    /// <inheritdoc/>
    public IReadOnlyList<string> ParameterNames => _emulator.ParameterNames;

    /// <inheritdoc/>
    public IReadOnlyList<double> Min => _emulator.Min;

    /// <inheritdoc/>
    public IReadOnlyList<double> Max => _emulator.Max;

    /// <inheritdoc/>
    public IReadOnlyList<double> K => _k;

    /// <inheritdoc/>
    public double Redshift { get; }

    /// <inheritdoc/>
    public Task<BasisSpectra[]> PredictAsync(IReadOnlyList<double[]> points, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(points);
        var results = new BasisSpectra[points.Count];
        if (points.Count < ParallelBatch)
        {
            for (int i = 0; i < points.Count; i++)
            {
                results[i] = Compute(points[i]);
            }
        }
        else
        {
            Parallel.For(0, points.Count, new ParallelOptions { CancellationToken = cancellation }, i => results[i] = Compute(points[i]));
        }

        return Task.FromResult(results);
    }

    /// <inheritdoc/>
    public void Dispose() => _predictors.Dispose();

    private BasisSpectra Compute(double[] point)
    {
        TheoryBox.Check(this, point);
        var values = new double[_emulator.Layout.Terms.Count * _k.Length];
        _predictors.Value!.Predict(point, _slice, values, [], []);
        return new BasisSpectra(_emulator.Layout, _k, values);
    }
}
