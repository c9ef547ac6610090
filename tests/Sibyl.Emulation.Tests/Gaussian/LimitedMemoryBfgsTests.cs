using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class LimitedMemoryBfgsTests
{
    [Fact]
    public void Finds_the_minimum_of_the_Rosenbrock_valley()
    {
        // Rosenbrock (1960): f = (1 − x)² + 100 (y − x²)², minimum 0 at (1, 1), a standard hard case for quasi-Newton.
        static double Rosenbrock(ReadOnlySpan<double> p, Span<double> g)
        {
            double a = 1.0 - p[0], b = p[1] - (p[0] * p[0]);
            g[0] = (-2.0 * a) - (400.0 * p[0] * b);
            g[1] = 200.0 * b;
            return (a * a) + (100.0 * b * b);
        }

        var (x, value, _) = new LimitedMemoryBfgs(gradientTolerance: 1e-10, relativeTolerance: 0.0).Minimize(Rosenbrock, [-1.2, 1.0], 500);
        // Converged to |∇f| ≤ 1e-10; near the minimum f ≈ ½ δᵀHδ, so x is within ~1e-8 of (1, 1).
        Assert.Equal(1.0, x[0], 1e-6);
        Assert.Equal(1.0, x[1], 1e-6);
        Assert.InRange(value, 0.0, 1e-12);
    }

    [Fact]
    public void Steps_back_from_a_region_where_the_objective_is_undefined()
    {
        // f = x − ln(x) has its minimum at x = 1 and is undefined (+∞ here) for x ≤ 0, where a full first step lands.
        static double Barrier(ReadOnlySpan<double> p, Span<double> g)
        {
            g[0] = 1.0 - (1.0 / p[0]);
            return p[0] > 0.0 ? p[0] - Math.Log(p[0]) : double.PositiveInfinity;
        }

        var (x, _, _) = new LimitedMemoryBfgs(gradientTolerance: 1e-9).Minimize(Barrier, [0.05], 100);
        Assert.Equal(1.0, x[0], 1e-6);
    }
}
