using Sibyl.Demo.Sampling;

namespace Sibyl.Demo.Tests.Sampling;

/// <summary>A correlated 2-D Gaussian (or a 1-D one when <c>Dimension</c> is 1) as a batch density, optionally cut to a box.</summary>
internal sealed class GaussianDensity(double[] mean, double[] sigma, double correlation, double[]? boxMin = null, double[]? boxMax = null) : IBatchLogDensity
{
    public int Dimension => mean.Length;

    public void Evaluate(IReadOnlyList<double[]> points, Span<double> logDensity)
    {
        for (int i = 0; i < points.Count; i++)
        {
            var x = points[i];
            bool inside = boxMin is null || x.Select((v, q) => v >= boxMin[q] && v <= boxMax![q]).All(b => b);
            if (!inside)
            {
                logDensity[i] = double.NegativeInfinity;
                continue;
            }

            double u = (x[0] - mean[0]) / sigma[0];
            if (Dimension == 1)
            {
                logDensity[i] = -0.5 * u * u;
                continue;
            }

            double v = (x[1] - mean[1]) / sigma[1];
            logDensity[i] = -0.5 * ((u * u) - (2 * correlation * u * v) + (v * v)) / (1 - (correlation * correlation));
        }
    }
}
