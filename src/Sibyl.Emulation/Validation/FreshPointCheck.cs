using Sibyl.Emulation.Emulators;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;

namespace Sibyl.Emulation.Validation;

/// <summary>
/// Compares an emulator with the direct calculation at fresh points of its box: a new Latin hypercube from its own
/// seed, so neither training nor held-out points, computed with the same calculation that made the training set.
/// </summary>
public static class FreshPointCheck
{
    /// <summary>The default seed of the fresh points: derived from the grid's, on a stream no design uses.</summary>
    public static ulong DefaultSeed(SpectrumEmulator emulator)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        return SeededRandom.Derive(emulator.Spec.Seed, 0xC4ECC);
    }

    /// <summary>Runs the comparison on <paramref name="threads"/> threads.</summary>
    /// <param name="emulator">The emulator.</param>
    /// <param name="points">Fresh points, at least 2.</param>
    /// <param name="seed">Seed of their Latin hypercube.</param>
    /// <param name="threads">Threads for the direct calculation.</param>
    /// <param name="progress">Receives the number of points done after each point.</param>
    /// <param name="failures">Receives each failed point's message.</param>
    /// <exception cref="ArgumentException">Every point failed, or there are fewer than 2.</exception>
    public static AccuracyReport Run(SpectrumEmulator emulator, int points, ulong seed, int threads, Action<int>? progress, Action<string>? failures)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        ArgumentOutOfRangeException.ThrowIfLessThan(points, 2);
        var spec = emulator.Spec with { TrainingPoints = points, HeldOutPoints = 0, Seed = seed };
        var design = TrainingDesign.Create(spec);
        var calculator = new PointCalculator(design);
        var comparisons = new Comparison?[points * emulator.SliceCount];
        int done = 0;
        using var predictors = new ThreadLocal<EmulatorPredictor>(emulator.CreatePredictor);
        Parallel.For(0, points, new ParallelOptions { MaxDegreeOfParallelism = threads }, i =>
        {
            try
            {
                Comparison.AtEverySlice(emulator, predictors.Value!, i, design.Point(i), calculator.Compute(i, CancellationToken.None))
                    .CopyTo(comparisons, i * emulator.SliceCount);
            }
            catch (Exception e) when (PointCalculator.IsPointFailure(e))
            {
                failures?.Invoke($"point {i}: {e.Message}");
            }

            progress?.Invoke(Interlocked.Increment(ref done));
        });

        var compared = comparisons.OfType<Comparison>().ToList();
        if (compared.Count == 0)
        {
            throw new ArgumentException("the direct calculation failed at every fresh point; nothing to compare");
        }

        return AccuracyReport.Measure("fresh direct-run", [.. emulator.Layout.Terms.Select(t => t.Name)], [.. emulator.K], compared);
    }
}
