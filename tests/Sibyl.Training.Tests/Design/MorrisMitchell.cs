namespace Sibyl.Training.Tests.Design;

/// <summary>
/// The space-filling criterion of Morris &amp; Mitchell (1995, J. Stat. Plan. Inference 43, 381),
/// φ_p = (Σ_{i&lt;j} d_ij^{−p})^{1/p} over Euclidean distances d_ij, written out plainly (square root and
/// <see cref="Math.Pow(double, double)"/>) so that it shares no code with the library's fast version.
/// </summary>
internal static class MorrisMitchell
{
    public static double Phi(ReadOnlySpan<double> design, int points, int dimensions, double p)
    {
        double sum = 0.0;
        for (int i = 0; i < points; i++)
        {
            for (int j = i + 1; j < points; j++)
            {
                double squared = 0.0;
                for (int c = 0; c < dimensions; c++)
                {
                    double d = design[(i * dimensions) + c] - design[(j * dimensions) + c];
                    squared += d * d;
                }

                sum += Math.Pow(Math.Sqrt(squared), -p);
            }
        }

        return Math.Pow(sum, 1.0 / p);
    }
}
