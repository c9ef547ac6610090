using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Emulators;

/// <summary>Choices of an emulator fit; the defaults are what bench/ measured to meet DESIGN.md's accuracy target.</summary>
public sealed record EmulatorFitOptions
{
    /// <summary>Covariance function of every process.</summary>
    public KernelKind Kernel { get; init; } = KernelKind.Matern52;

    /// <summary>
    /// Leading principal components of each block that get a Gaussian process of their own; the remaining ones share
    /// one process (one kernel, one Cholesky factor). The leading component carries nearly all the variance and
    /// deserves its own length scales; sharing the rest keeps prediction to two kernel vectors per term. Measured on
    /// the 7-parameter nDGP matter box at 1000 points (99th-percentile held-out error of P_tree_plus_loop): 0 gives
    /// 0.080 %, 1 gives 0.034 %, 4 gives 0.026 % at 2.5 times the prediction cost of 1.
    /// </summary>
    public int SeparateComponents { get; init; } = 1;

    /// <summary>Degree of the polynomial trend (0, 1 or 2).</summary>
    public int TrendDegree { get; init; } = 2;

    /// <summary>
    /// Largest principal-component reconstruction error allowed on the training set, in transformed units: ln P for
    /// log targets (1e-4 is 0.01 %, a tenth of DESIGN.md's 0.1 % emulation target), the term's RMS at k for linear ones.
    /// </summary>
    public double ComponentTolerance { get; init; } = 1e-4;

    /// <summary>At most this many components per block.</summary>
    public int MaxComponents { get; init; } = 40;

    /// <summary>
    /// Hyperparameters are optimised on at most this many training points (the first ones of the Latin hypercube, a
    /// space-filling subset), then the process is conditioned on all of them: the likelihood's O(n³) cost per step
    /// makes a full optimisation at thousands of points impractical, and the length scales settle well before that.
    /// </summary>
    public int HyperparameterPoints { get; init; } = 400;

    /// <summary>Optimiser restarts beyond the first start.</summary>
    public int Restarts { get; init; } = 2;

    /// <summary>Optimiser iterations per start.</summary>
    public int MaxIterations { get; init; } = 200;

    /// <summary>
    /// Keep the Cholesky factors so that predictive variances are available. Off by default: they cost n² numbers per
    /// process (32 MB each at 2000 training points) while the mean needs only n per output.
    /// </summary>
    public bool KeepVariance { get; init; }

    /// <summary>Seed of the optimiser restarts.</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>Processes fitted in parallel.</summary>
    public int Threads { get; init; } = Environment.ProcessorCount;
}
