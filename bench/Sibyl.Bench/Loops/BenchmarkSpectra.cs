namespace Sibyl.Bench.Loops;

/// <summary>Inputs shared by the loop benchmarks: an INVENTED ΛCDM-like spectrum (not a fit to any cosmology).</summary>
internal static class BenchmarkSpectra
{
    /// <summary>100 log-spaced k from 0.005 to 0.5 h/Mpc.</summary>
    public static double[] OutputGrid()
    {
        var k = new double[100];
        for (int i = 0; i < k.Length; i++)
        {
            k[i] = 0.005 * Math.Pow(100.0, i / 99.0);
        }

        return k;
    }

    /// <summary>INVENTED: A q^0.96/(1 + (q/0.03)²)² with 5 % Silk-damped wiggles of period 0.06 h/Mpc.</summary>
    public static double Wiggly(double q) => Smooth(q) * (1.0 + (0.05 * Math.Sin(105.0 * q) * Math.Exp(-(q / 0.2) * (q / 0.2))));

    /// <summary>INVENTED no-wiggle partner of <see cref="Wiggly"/>.</summary>
    public static double Smooth(double q)
    {
        double x = q / 0.03;
        return 1.7e6 * Math.Pow(q, 0.96) / ((1.0 + (x * x)) * (1.0 + (x * x)));
    }
}
