namespace Sibyl.Perturbation.Loops;

/// <summary>Gauss–Legendre nodes and weights on [−1, 1], found by Newton iteration on the Legendre recurrence.</summary>
internal sealed class GaussLegendreRule
{
    private GaussLegendreRule(double[] nodes, double[] weights)
    {
        Nodes = nodes;
        Weights = weights;
    }

    /// <summary>Nodes on [−1, 1], ascending.</summary>
    public double[] Nodes { get; }

    /// <summary>Weights, summing to 2.</summary>
    public double[] Weights { get; }

    /// <summary>Number of nodes.</summary>
    public int Count => Nodes.Length;

    /// <summary>The n-point rule (exact for polynomials of degree 2n − 1).</summary>
    public static GaussLegendreRule Create(int count)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        var nodes = new double[count];
        var weights = new double[count];
        for (int i = 0; i < (count + 1) / 2; i++)
        {
            // Tricomi's estimate of the i-th largest root is within Newton's quadratic basin.
            double x = Math.Cos(Math.PI * (i + 0.75) / (count + 0.5));
            double derivative = 0.0;
            for (int iteration = 0; iteration < 100; iteration++)
            {
                (double value, derivative) = Legendre(count, x);
                double step = value / derivative;
                x -= step;
                if (Math.Abs(step) <= 1e-16)
                {
                    break;
                }
            }

            (_, derivative) = Legendre(count, x);
            double weight = 2.0 / ((1.0 - (x * x)) * derivative * derivative);
            nodes[i] = -x;
            nodes[count - 1 - i] = x;
            weights[i] = weight;
            weights[count - 1 - i] = weight;
        }

        if (count % 2 == 1)
        {
            nodes[count / 2] = 0.0;
        }

        return new GaussLegendreRule(nodes, weights);
    }

    private static (double Value, double Derivative) Legendre(int degree, double x)
    {
        double previous = 1.0;
        double current = x;
        for (int l = 2; l <= degree; l++)
        {
            double next = (((2 * l) - 1) * x * current - ((l - 1) * previous)) / l;
            previous = current;
            current = next;
        }

        double derivative = degree * ((x * current) - previous) / ((x * x) - 1.0);
        return (current, derivative);
    }
}
