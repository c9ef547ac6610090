using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Emulation.Tests.Emulators;

public sealed class QuadraticTrendTests
{
    private static double Quadratic(double x, double y, double z) => 1.5 - (2 * x) + (0.5 * y) + (3 * x * y) - (z * z) + (0.25 * y * z);

    [Fact]
    public void A_quadratic_is_fitted_exactly_with_its_gradient()
    {
        // Least squares on a quadratic that lies in the model space recovers it to round-off: 1e-12 relative to
        // values of order one is a few hundred ulps of the QR solve.
        var random = new Random(3);
        var inputs = Matrix<double>.Build.Dense(30, 3, (_, _) => random.NextDouble());
        var outputs = Matrix<double>.Build.Dense(30, 1, (i, _) => Quadratic(inputs[i, 0], inputs[i, 1], inputs[i, 2]));
        var trend = QuadraticTrend.Fit(inputs, outputs, degree: 2);
        double[] point = [0.3, 0.8, 0.45];
        var value = new double[1];
        var gradient = new double[3];
        trend.Add(point, value, gradient);
        Assert.Equal(Quadratic(0.3, 0.8, 0.45), value[0], 12);
        Assert.Equal(-2 + (3 * 0.8), gradient[0], 12);
        Assert.Equal(0.5 + (3 * 0.3) + (0.25 * 0.45), gradient[1], 12);
        Assert.Equal((-2 * 0.45) + (0.25 * 0.8), gradient[2], 12);
    }

    [Fact]
    public void Too_few_points_for_the_degree_are_refused()
    {
        var inputs = Matrix<double>.Build.Dense(5, 3, 0.5);
        var outputs = Matrix<double>.Build.Dense(5, 1, 1.0);
        Assert.Throws<ArgumentException>(() => QuadraticTrend.Fit(inputs, outputs, degree: 2));
    }
}
