namespace Sibyl.Demo.Numerics;

/// <summary>
/// Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz &amp; Stegun 25.4.29): n nodes integrate polynomials of
/// degree up to 2n − 1 exactly. Nodes are roots of P_n found by Newton's method from Tricomi's first guess.
/// </summary>
public static class GaussLegendre
{
    /// <summary>The n-point rule.</summary>
    /// <param name="n">Number of nodes, at least 1.</param>
    /// <returns>Nodes in increasing order and their weights (which sum to 2).</returns>
    public static (double[] Nodes, double[] Weights) Rule(int n)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(n, 1);
        var nodes = new double[n];
        var weights = new double[n];
        for (int i = 0; i < (n + 1) / 2; i++)
        {
            double x = Math.Cos(Math.PI * (i + 0.75) / (n + 0.5));
            for (int iteration = 0; iteration < 100; iteration++)
            {
                (double p, double dp) = Legendre(n, x);
                double step = p / dp;
                x -= step;
                if (Math.Abs(step) < 1e-15)
                {
                    break;
                }
            }

            double derivative = Legendre(n, x).Derivative;
            double w = 2.0 / ((1.0 - (x * x)) * derivative * derivative);
            nodes[i] = -x;
            nodes[n - 1 - i] = x;
            weights[i] = w;
            weights[n - 1 - i] = w;
        }

        return (nodes, weights);
    }

    /// <summary>P_n(x) and P_n'(x) by the three-term recurrence.</summary>
    private static (double Value, double Derivative) Legendre(int n, double x)
    {
        double previous = 1.0, current = x;
        if (n == 0)
        {
            return (1.0, 0.0);
        }

        for (int k = 2; k <= n; k++)
        {
            double next = (((2 * k) - 1) * x * current - ((k - 1) * previous)) / k;
            previous = current;
            current = next;
        }

        return (current, n * ((x * current) - previous) / ((x * x) - 1.0));
    }
}
