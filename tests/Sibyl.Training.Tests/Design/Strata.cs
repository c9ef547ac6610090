using Sibyl.Training.Design;

namespace Sibyl.Training.Tests.Design;

/// <summary>
/// The Latin-hypercube property of McKay, Beckman &amp; Conover (1979, Technometrics 21, 239): in every 1-D
/// projection of n points, each of the n strata [j/n, (j+1)/n) holds exactly one point.
/// </summary>
internal static class Strata
{
    public static void AssertOnePointPerStratum(ReadOnlySpan<double> design, int points, int dimensions)
    {
        Assert.Equal(points * dimensions, design.Length);
        for (int c = 0; c < dimensions; c++)
        {
            var seen = new bool[points];
            for (int i = 0; i < points; i++)
            {
                double x = design[(i * dimensions) + c];
                Assert.InRange(x, 0.0, 1.0);

                // Computed here rather than with LatinHypercube.Stratum, so the check does not lean on the code it checks.
                int stratum = (int)Math.Floor(x * points);
                Assert.InRange(stratum, 0, points - 1);
                Assert.False(seen[stratum], $"column {c}: stratum {stratum} of {points} holds two points");
                seen[stratum] = true;
            }
        }
    }

    public static double[] Block(TrainingDesign design, int start, int end)
    {
        var block = new List<double>();
        for (int i = start; i < end; i++)
        {
            block.AddRange(design.Unit(i).ToArray());
        }

        return [.. block];
    }
}
