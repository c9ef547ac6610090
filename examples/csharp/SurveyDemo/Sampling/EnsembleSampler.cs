namespace Sibyl.Demo.Sampling;

/// <summary>
/// The affine-invariant ensemble sampler of Goodman &amp; Weare (2010, CAMCoS 5, 65) with their stretch move: walker X_k
/// moves to Y = X_j + Z (X_k − X_j) towards or away from another walker X_j, with Z drawn from g(z) ∝ 1/√z on
/// [1/a, a], and is accepted with probability min(1, Z^{d−1} p(Y)/p(X_k)). The ensemble is updated in two halves, each
/// walker of one half paired with a walker drawn from the other, which is held fixed meanwhile: each half-step is then a
/// valid stretch move conditional on the other half (so the ensemble's joint target is preserved), and all proposals of
/// a half are independent of each other and evaluated in one batch. Seeded: the same seed, start and density give the
/// same chain.
/// </summary>
public sealed class EnsembleSampler
{
    private readonly double _a;
    private readonly Random _random;

    /// <summary>Creates a sampler.</summary>
    /// <param name="seed">Seed of the proposals and acceptances.</param>
    /// <param name="stretch">The scale a of the stretch move, greater than 1 (Goodman &amp; Weare recommend 2).</param>
    public EnsembleSampler(int seed, double stretch = 2.0)
    {
        if (!(stretch > 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(stretch), stretch, "the stretch scale a must exceed 1");
        }

        _a = stretch;
        _random = new Random(seed);
    }

    /// <summary>Runs <paramref name="steps"/> steps of the ensemble from <paramref name="start"/>.</summary>
    /// <param name="density">The target.</param>
    /// <param name="start">One starting point per walker, an even number of at least 4, each with finite ln p.</param>
    /// <param name="steps">Number of steps (every walker moves, or stays, once per step).</param>
    /// <param name="progress">Called after every step with the step count.</param>
    /// <exception cref="ArgumentException">Odd or too few walkers, wrong dimensions, or a start outside the support.</exception>
    public EnsembleChain Run(IBatchLogDensity density, IReadOnlyList<double[]> start, int steps, Action<int>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(density);
        ArgumentNullException.ThrowIfNull(start);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(steps);
        int walkers = start.Count, d = density.Dimension;
        if (walkers < 4 || walkers % 2 != 0 || start.Any(p => p.Length != d))
        {
            throw new ArgumentException($"need an even number (at least 4) of starting points of {d} values, got {walkers}", nameof(start));
        }

        double[][] x = [.. start.Select(p => (double[])p.Clone())];
        var logP = new double[walkers];
        density.Evaluate(x, logP);
        if (logP.Any(v => !double.IsFinite(v)))
        {
            throw new ArgumentException("every starting point needs a finite log density (inside the prior box)", nameof(start));
        }

        var chain = new EnsembleChain(d, walkers, steps);
        int half = walkers / 2;
        var proposals = new double[half][];
        var zs = new double[half];
        var proposalLogP = new double[half];
        for (int step = 0; step < steps; step++)
        {
            for (int h = 0; h < 2; h++)
            {
                int first = h * half, other = (1 - h) * half;
                for (int i = 0; i < half; i++)
                {
                    var xk = x[first + i];
                    var xj = x[other + _random.Next(half)];
                    double u = _random.NextDouble();
                    double z = ((_a - 1.0) * u + 1.0) * ((_a - 1.0) * u + 1.0) / _a;
                    zs[i] = z;
                    var y = new double[d];
                    for (int q = 0; q < d; q++)
                    {
                        y[q] = xj[q] + (z * (xk[q] - xj[q]));
                    }

                    proposals[i] = y;
                }

                density.Evaluate(proposals, proposalLogP);
                for (int i = 0; i < half; i++)
                {
                    double logAccept = ((d - 1) * Math.Log(zs[i])) + proposalLogP[i] - logP[first + i];
                    if (double.IsFinite(proposalLogP[i]) && Math.Log(_random.NextDouble()) < logAccept)
                    {
                        x[first + i] = proposals[i];
                        logP[first + i] = proposalLogP[i];
                        chain.Accepted++;
                    }
                }
            }

            chain.Record(step, x, logP);
            progress?.Invoke(step + 1);
        }

        return chain;
    }
}
