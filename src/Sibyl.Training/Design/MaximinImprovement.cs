namespace Sibyl.Training.Design;

/// <summary>
/// Spreads a Latin hypercube apart by the criterion of Morris &amp; Mitchell (1995, J. Stat. Plan. Inference 43,
/// 381): minimise φ_p = (Σ_{i&lt;j} d_ij^{−p})^{1/p}, which for large p ranks designs by their smallest
/// pairwise distance, then by how often it occurs. Their perturbation swaps two values within one column, so
/// every 1-D projection keeps exactly one point per stratum; a swap is kept when it lowers φ_p (the greedy
/// limit of their annealing, enough for the few-hundred to few-thousand points of a training design).
/// </summary>
public static class MaximinImprovement
{
    /// <summary>The exponent p (Morris &amp; Mitchell use 1–100; larger values approach pure maximin), fixed so that d^{−p} is a few multiplications.</summary>
    public const double Exponent = 20.0;

    /// <summary>
    /// Improves <paramref name="design"/> in place (row-major n × d) with <paramref name="trials"/> proposed swaps
    /// and returns φ_p before and after.
    /// </summary>
    /// <exception cref="ArgumentException">The design length is not n·d.</exception>
    public static (double Before, double After) Improve(double[] design, int points, int dimensions, int trials, SeededRandom random)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(random);
        if (design.Length != points * dimensions)
        {
            throw new ArgumentException($"design holds {design.Length} values, not {points} × {dimensions}", nameof(design));
        }

        double before = Phi(PairSum(design, points, dimensions));
        if (points < 3)
        {
            return (before, before);
        }

        for (int t = 0; t < trials; t++)
        {
            int column = random.NextInt(dimensions);
            int first = random.NextInt(points);
            int second = random.NextInt(points - 1);
            if (second >= first)
            {
                second++;
            }

            // The two rows' mutual distance does not change under the swap; only their distances to the rest do.
            double old = RowSum(design, points, dimensions, first, second) + RowSum(design, points, dimensions, second, first);
            Swap(design, dimensions, column, first, second);
            double proposed = RowSum(design, points, dimensions, first, second) + RowSum(design, points, dimensions, second, first);
            // Only a swap that lowers the sum is kept (a NaN sum never is).
            if (!(proposed < old))
            {
                Swap(design, dimensions, column, first, second);
            }
        }

        return (before, Phi(PairSum(design, points, dimensions)));
    }

    /// <summary>φ_p of a design.</summary>
    public static double Criterion(ReadOnlySpan<double> design, int points, int dimensions) => Phi(PairSum(design, points, dimensions));

    /// <summary>Smallest Euclidean distance between two points of a design.</summary>
    public static double MinimumDistance(ReadOnlySpan<double> design, int points, int dimensions)
    {
        double best = double.PositiveInfinity;
        for (int i = 0; i < points; i++)
        {
            for (int j = i + 1; j < points; j++)
            {
                best = Math.Min(best, DistanceSquared(design, dimensions, i, j));
            }
        }

        return Math.Sqrt(best);
    }

    private static double Phi(double sum) => Math.Pow(sum, 1.0 / Exponent);

    private static double PairSum(ReadOnlySpan<double> design, int points, int dimensions)
    {
        double sum = 0.0;
        for (int i = 0; i < points; i++)
        {
            for (int j = i + 1; j < points; j++)
            {
                sum += Term(DistanceSquared(design, dimensions, i, j));
            }
        }

        return sum;
    }

    private static double RowSum(ReadOnlySpan<double> design, int points, int dimensions, int row, int skip)
    {
        double sum = 0.0;
        for (int j = 0; j < points; j++)
        {
            if (j != row && j != skip)
            {
                sum += Term(DistanceSquared(design, dimensions, row, j));
            }
        }

        return sum;
    }

    // d^{−20} = (1/d²)^10 by multiplication, several times faster than Math.Pow in the inner loop; the floor keeps
    // coincident points (impossible in a Latin hypercube, but cheap to guard) finite.
    private static double Term(double distanceSquared)
    {
        double x = 1.0 / Math.Max(distanceSquared, 1e-24);
        double x2 = x * x;
        double x4 = x2 * x2;
        double x5 = x4 * x;
        return x5 * x5;
    }

    private static double DistanceSquared(ReadOnlySpan<double> design, int dimensions, int i, int j)
    {
        var a = design.Slice(i * dimensions, dimensions);
        var b = design.Slice(j * dimensions, dimensions);
        double sum = 0.0;
        for (int c = 0; c < dimensions; c++)
        {
            double d = a[c] - b[c];
            sum += d * d;
        }

        return sum;
    }

    private static void Swap(double[] design, int dimensions, int column, int first, int second) =>
        (design[(first * dimensions) + column], design[(second * dimensions) + column]) =
        (design[(second * dimensions) + column], design[(first * dimensions) + column]);
}
