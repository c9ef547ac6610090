using Sibyl.Cosmology.Numerics;

namespace Sibyl.Cosmology.Tests.Numerics;

public class LinearRosenbrock2Tests
{
    [Fact]
    public void Stiff_relaxation_towards_a_moving_target_follows_the_exact_solution()
    {
        // Prothero & Robinson (1974, Math. Comp. 28, 145) test, written as a homogeneous linear system by carrying
        // the forcing in two extra components: u = cos t, v = sin t obey u' = −v, v' = u, and y' = λ(y − u) − v has
        // the solution y = u = cos t for y(0) = 1. With λ = −1e6 an explicit method needs steps below 3e-6; the
        // implicit one must follow cos t to its tolerance (1e-7 relative per step, about 1e-6 accumulated) over [0, 2].
        const double lambda = -1e6;
        void Rhs(double t, ReadOnlySpan<double> y, Span<double> dy)
        {
            dy[0] = lambda * (y[0] - y[1]) - y[2];
            dy[1] = -y[2];
            dy[2] = y[1];
        }

        var state = new[] { 1.0, 1.0, 0.0 };
        double step = 1e-3;
        var integrator = new LinearRosenbrock2(3);
        integrator.Integrate(Rhs, state, 3, 0.0, 2.0, ref step, 1e-7, 1e-10, maxSteps: 20_000);
        Assert.Equal(Math.Cos(2.0), state[0], 1e-5);
        Assert.Equal(Math.Cos(2.0), state[1], 1e-5);
    }

    [Fact]
    public void Error_falls_as_the_square_of_the_step_on_a_smooth_nonautonomous_problem()
    {
        // ROS2 is of order 2 (Verwer et al. 1999) also when A depends on t and is taken at the step start only.
        // y' = t·y, y(0) = 1 has y = exp(t²/2). With fixed steps (tolerance so loose that no step is rejected and
        // the first step bound decides), halving the step must cut the error by 4: accept 3.5–4.5.
        static void Rhs(double t, ReadOnlySpan<double> y, Span<double> dy) => dy[0] = t * y[0];
        double Error(int steps)
        {
            var state = new[] { 1.0 };
            double h = 1.0 / steps;
            var integrator = new LinearRosenbrock2(1);
            for (int i = 0; i < steps; i++)
            {
                double step = h;
                integrator.Integrate(Rhs, state, 1, i * h, (i + 1) * h, ref step, 1.0, 1.0);
            }

            return Math.Abs(state[0] - Math.Exp(0.5));
        }

        double ratio = Error(200) / Error(400);
        Assert.InRange(ratio, 3.5, 4.5);
    }

    [Fact]
    public void Very_stiff_decay_is_damped_in_one_large_step()
    {
        // L-stability: the stability function vanishes at infinity for γ = 1 + 1/√2, so a mode with hλ = −1e8 is
        // removed in one step instead of oscillating (a trapezoid rule would return −y). Residual below 1e-6.
        static void Rhs(double t, ReadOnlySpan<double> y, Span<double> dy) => dy[0] = -1e8 * y[0];
        var state = new[] { 1.0 };
        double step = 1.0;
        new LinearRosenbrock2(1).Integrate(Rhs, state, 1, 0.0, 1.0, ref step, 1.0, 1.0);
        Assert.InRange(Math.Abs(state[0]), 0.0, 1e-6);
    }
}
