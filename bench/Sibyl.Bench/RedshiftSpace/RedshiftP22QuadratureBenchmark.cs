using BenchmarkDotNet.Attributes;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Bench.RedshiftSpace;

/// <summary>
/// The redshift-space P_22 momentum integrals at 60 log-spaced k in 0.01–0.3 h/Mpc: building the plan once, and
/// evaluating it for two spectra (a wiggly one and its no-wiggle partner) in one pass, as a training run does.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class RedshiftP22QuadratureBenchmark
{
    private const int KCount = 60;

    private double[] _k = null!;
    private RedshiftP22Quadrature _plan = null!;
    private LogSampledSpectrum _wiggly = null!;
    private LogSampledSpectrum _smooth = null!;
    private RedshiftP22Integrals _first = null!;
    private RedshiftP22Integrals _second = null!;

    [GlobalSetup]
    public void Setup()
    {
        _k = new double[KCount];
        for (int i = 0; i < KCount; i++)
        {
            _k[i] = 0.01 * Math.Pow(30.0, i / (KCount - 1.0));
        }

        _plan = new RedshiftP22Quadrature(_k);
        // INVENTED ΛCDM-like shape with 5 % wiggles (not a fit to any cosmology).
        _smooth = new LogSampledSpectrum(q => 2e5 * Math.Pow(q, 0.96) / Math.Pow(1.0 + ((q / 0.02) * (q / 0.02)), 1.4));
        _wiggly = new LogSampledSpectrum(q => _smooth.Evaluate(q) * (1.0 + (0.05 * Math.Sin(105.0 * q) * Math.Exp(-(q / 0.2) * (q / 0.2)))));
        _first = new RedshiftP22Integrals(KCount);
        _second = new RedshiftP22Integrals(KCount);
        Console.WriteLine($"// plan: grid {_plan.GridCount} nodes, weights {_plan.WeightBytes} bytes");
    }

    [Benchmark(Description = "build the plan (60 k)")]
    public RedshiftP22Quadrature Build() => new(_k);

    [Benchmark(Baseline = true, Description = "two spectra, all J_ab,n (60 k)")]
    public RedshiftP22Integrals ComputeTwo()
    {
        _plan.Compute(_wiggly, _smooth, _first, _second);
        return _second;
    }
}
