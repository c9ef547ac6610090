namespace Sibyl.Demo.Sampling;

/// <summary>
/// Integrated autocorrelation time τ of a chain, in steps: τ = 1 + 2 Σ_{t=1}^{M} ρ(t), with the autocorrelation ρ
/// averaged over walkers and the window M the smallest with M ≥ c τ(M), c = 5 (Sokal 1997, "Monte Carlo methods in
/// statistical mechanics", §3, the automatic windowing). A chain shorter than about 50 τ gives an underestimate.
/// </summary>
public static class AutocorrelationTime
{
    private const double Window = 5.0;

    /// <summary>τ of parameter <paramref name="parameter"/> over steps [<paramref name="burnIn"/>, end).</summary>
    public static double Estimate(EnsembleChain chain, int parameter, int burnIn)
    {
        ArgumentNullException.ThrowIfNull(chain);
        int n = chain.Steps - burnIn;
        if (n < 4)
        {
            return double.NaN;
        }

        var rho = new double[n];
        for (int w = 0; w < chain.Walkers; w++)
        {
            var series = new double[n];
            for (int s = 0; s < n; s++)
            {
                series[s] = chain.Position(burnIn + s, w)[parameter];
            }

            double mean = series.Average();
            double c0 = series.Sum(v => (v - mean) * (v - mean)) / n;
            if (c0 <= 0.0)
            {
                continue;
            }

            for (int t = 0; t < n; t++)
            {
                double c = 0.0;
                for (int s = 0; s + t < n; s++)
                {
                    c += (series[s] - mean) * (series[s + t] - mean);
                }

                rho[t] += c / n / c0 / chain.Walkers;
            }
        }

        double tau = 1.0;
        for (int m = 1; m < n; m++)
        {
            tau += 2.0 * rho[m];
            if (m >= Window * tau)
            {
                return tau;
            }
        }

        return tau;
    }
}
