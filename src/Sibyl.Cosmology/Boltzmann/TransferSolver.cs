using System.Runtime.ExceptionServices;
using Sibyl.Cosmology.Boltzmann.Perturbations;
using Sibyl.Cosmology.Boltzmann.Recombination;

namespace Sibyl.Cosmology.Boltzmann;

/// <summary>
/// The matter density contrast today per unit primordial curvature, δ_m(k)/ζ, at a set of wavenumbers, the modes
/// spread over worker threads (largest k first, since they cost the most).
/// </summary>
public sealed class TransferSolver
{
    private readonly ModeBackground _background;
    private readonly BoltzmannSettings _settings;

    /// <summary>Prepares the background, the thermal history and their table for <paramref name="background"/>.</summary>
    public TransferSolver(RadiationBackground background, double heliumFraction, BoltzmannSettings? settings = null)
    {
        ArgumentNullException.ThrowIfNull(background);
        _settings = settings ?? new BoltzmannSettings();
        _settings.Validate();
        Thermal = ThermalHistory.Solve(background, heliumFraction);
        _background = new ModeBackground(background, Thermal);
    }

    /// <summary>The thermal history (recombination, drag epoch, sound horizons).</summary>
    public ThermalHistory Thermal { get; }

    /// <summary>The tabulated background the modes read.</summary>
    public ModeBackground Background => _background;

    /// <summary>δ_m(k, a = 1)/ζ for each <paramref name="k"/> in 1/Mpc.</summary>
    /// <param name="k">Wavenumbers in 1/Mpc, positive.</param>
    /// <param name="threads">Worker threads; 0 for all cores.</param>
    /// <exception cref="ArithmeticException">A mode failed to integrate; the message names its k. The other workers stop.</exception>
    public double[] MatterContrast(IReadOnlyList<double> k, int threads = 0)
    {
        ArgumentNullException.ThrowIfNull(k);
        var result = new double[k.Count];
        var order = Enumerable.Range(0, k.Count).OrderByDescending(i => k[i]).ToArray();
        int next = -1;
        int failed = 0;
        int workers = Math.Clamp(threads <= 0 ? Environment.ProcessorCount : threads, 1, Math.Max(1, k.Count));
        void Work()
        {
            var solver = new ModeSolver(_background, _settings);
            for (int j = Interlocked.Increment(ref next); j < order.Length && Volatile.Read(ref failed) == 0; j = Interlocked.Increment(ref next))
            {
                int i = order[j];
                try
                {
                    result[i] = solver.MatterContrast(k[i]);
                }
                catch
                {
                    Volatile.Write(ref failed, 1);
                    throw;
                }
            }
        }

        if (workers == 1)
        {
            Work();
        }
        else
        {
            var tasks = new Task[workers];
            for (int w = 0; w < workers; w++)
            {
                tasks[w] = Task.Factory.StartNew(Work, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
            }

            try
            {
                Task.WaitAll(tasks);
            }
            catch (AggregateException e)
            {
                // Callers handle the mode's own exception (ArithmeticException), not the tasks' wrapper.
                ExceptionDispatchInfo.Capture(e.InnerExceptions[0]).Throw();
            }
        }

        return result;
    }
}
