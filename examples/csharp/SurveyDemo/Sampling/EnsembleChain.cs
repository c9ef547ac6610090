namespace Sibyl.Demo.Sampling;

/// <summary>The positions and log densities of every walker after every step of an ensemble run.</summary>
public sealed class EnsembleChain
{
    private readonly double[] _positions;
    private readonly double[] _logDensity;

    /// <summary>An empty chain of the given size.</summary>
    public EnsembleChain(int dimension, int walkers, int steps)
    {
        Dimension = dimension;
        Walkers = walkers;
        Steps = steps;
        _positions = new double[steps * walkers * dimension];
        _logDensity = new double[steps * walkers];
    }

    /// <summary>Parameters per point.</summary>
    public int Dimension { get; }

    /// <summary>Walkers in the ensemble.</summary>
    public int Walkers { get; }

    /// <summary>Steps recorded.</summary>
    public int Steps { get; }

    /// <summary>Accepted proposals over the whole run.</summary>
    public long Accepted { get; internal set; }

    /// <summary>Accepted fraction of all proposals.</summary>
    public double AcceptanceFraction => (double)Accepted / ((long)Steps * Walkers);

    /// <summary>Position of <paramref name="walker"/> after <paramref name="step"/>.</summary>
    public ReadOnlySpan<double> Position(int step, int walker) => _positions.AsSpan(((step * Walkers) + walker) * Dimension, Dimension);

    /// <summary>ln p of <paramref name="walker"/> after <paramref name="step"/>.</summary>
    public double LogDensity(int step, int walker) => _logDensity[(step * Walkers) + walker];

    /// <summary>Every position after the first <paramref name="burnIn"/> steps, step-major.</summary>
    public IEnumerable<double[]> Samples(int burnIn)
    {
        for (int s = burnIn; s < Steps; s++)
        {
            for (int w = 0; w < Walkers; w++)
            {
                yield return Position(s, w).ToArray();
            }
        }
    }

    internal void Record(int step, double[][] positions, double[] logDensity)
    {
        for (int w = 0; w < Walkers; w++)
        {
            positions[w].CopyTo(_positions.AsSpan(((step * Walkers) + w) * Dimension, Dimension));
            _logDensity[(step * Walkers) + w] = logDensity[w];
        }
    }
}
