namespace Sibyl.Training.Design;

/// <summary>
/// Latin hypercube samples of the unit cube (McKay, Beckman &amp; Conover 1979, Technometrics 21, 239): each of
/// the d coordinates of n points takes every one of the n strata [j/n, (j+1)/n) exactly once, at a uniformly
/// random place inside the stratum; the strata of different coordinates are paired by independent random
/// permutations.
/// </summary>
public static class LatinHypercube
{
    /// <summary>Draws n points in d dimensions; row-major, point i's coordinate c at [i·d + c].</summary>
    /// <exception cref="ArgumentOutOfRangeException">n or d is not positive.</exception>
    public static double[] Sample(int points, int dimensions, SeededRandom random)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(points);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(dimensions);
        ArgumentNullException.ThrowIfNull(random);
        var design = new double[points * dimensions];
        var strata = new int[points];
        for (int c = 0; c < dimensions; c++)
        {
            for (int i = 0; i < points; i++)
            {
                strata[i] = i;
            }

            // Fisher–Yates shuffle.
            for (int i = points - 1; i > 0; i--)
            {
                int j = random.NextInt(i + 1);
                (strata[i], strata[j]) = (strata[j], strata[i]);
            }

            for (int i = 0; i < points; i++)
            {
                design[(i * dimensions) + c] = (strata[i] + random.NextDouble()) / points;
            }
        }

        return design;
    }
}
