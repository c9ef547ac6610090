using Sibyl.Cosmology.Boltzmann.Recombination;

namespace Sibyl.Cosmology.Tests.Boltzmann.Recombination;

public class LnAGridTests
{
    private static double Cubic(double x) => 0.3 - 1.7 * x + 0.9 * x * x + 0.25 * x * x * x;

    private static double CubicIntegral(double x) => 0.3 * x - 0.85 * x * x + 0.3 * x * x * x + 0.0625 * x * x * x * x;

    [Theory]
    [InlineData(-2.0)]
    [InlineData(-1.93)]
    [InlineData(0.4567)]
    [InlineData(1.0)]
    [InlineData(0.987)]
    public void Cubic_interpolation_is_exact_for_cubics(double x)
    {
        // Four-point Lagrange interpolation reproduces any cubic, also in the off-centre end intervals;
        // 1e-12 is rounding for values of order 1.
        var grid = new LnAGrid(-2.0, 0.1, 31);
        var values = Enumerable.Range(0, grid.Count).Select(i => Cubic(grid.LnA(i))).ToArray();

        Assert.Equal(Cubic(x), grid.Interpolate(values, x), 1e-12);
    }

    [Fact]
    public void Cumulative_integrals_are_exact_for_cubics()
    {
        // The four-point interval rules (centred and one-sided) integrate cubics exactly; 1e-12 is rounding.
        var grid = new LnAGrid(-2.0, 0.1, 31);
        var values = Enumerable.Range(0, grid.Count).Select(i => Cubic(grid.LnA(i))).ToArray();
        var fromStart = new double[grid.Count];
        var toEnd = new double[grid.Count];

        grid.IntegrateFromStart(values, 0.5, fromStart);
        grid.IntegrateToEnd(values, toEnd);

        for (int i = 0; i < grid.Count; i++)
        {
            double x = grid.LnA(i);
            Assert.Equal(0.5 + CubicIntegral(x) - CubicIntegral(grid.Start), fromStart[i], 1e-12);
            Assert.Equal(CubicIntegral(grid.End) - CubicIntegral(x), toEnd[i], 1e-12);
        }
    }
}
