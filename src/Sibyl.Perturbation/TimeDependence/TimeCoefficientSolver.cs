using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Numerics;

namespace Sibyl.Perturbation.TimeDependence;

/// <summary>
/// Solves the fluid equations order by order in ln a with the modified Poisson equation of
/// <see cref="IGravityModel"/>: δ' − Θ = α[Θ, δ], Θ' + (2 + d ln H/d ln a) Θ − (3/2) Ω_m μ δ = β[Θ, Θ] + γ2 𝒩[δ, δ] + γ3 𝒩[δ, 𝒩[δ, δ]].
/// Each kernel coefficient obeys the linear growth operator with a source built from lower orders, so
/// one RK4 pass over 18 coupled equations gives all of them. It starts at a = 1e-3 on the
/// Einstein–de Sitter solution (error there of order Ω_DE(1e-3) ≈ 1e-9 and, for nDGP, μ − 1 ≈ 1e-5 √Ω_rc,
/// both decaying relative to the growing solution).
/// </summary>
public static class TimeCoefficientSolver
{
    /// <summary>Where integration starts.</summary>
    public const double InitialScaleFactor = 1e-3;

    /// <summary>RK4 steps per e-fold; 100 keeps the truncation error of the a³ terms near 1e-7.</summary>
    public const int StepsPerEFold = 100;

    private const int Structures = 7;
    private const int Dimension = 4 + 2 * Structures;

    // Einstein–de Sitter growing solutions per a³: X = (sΘ + (7/2) sδ)/9 for sources sδ a³ in continuity
    // and sΘ a³ in Euler (from 3X − Y = sδ, (7/2)Y − (3/2)X = sΘ).
    private static readonly double[] EdsDensity = [7.0 / 18.0, -2.0 / 9.0, 2.0 / 9.0, -8.0 / 63.0, 0.0, 0.0, -1.0 / 9.0];
    private static readonly double[] EdsContinuitySource = [1.0, -4.0 / 7.0, 0.0, 0.0, 0.0, 0.0, -2.0 / 7.0];

    /// <summary>Coefficients at every scale factor in <paramref name="scaleFactors"/> (any order, each in [0.01, 1]).</summary>
    /// <exception cref="ArgumentOutOfRangeException">A scale factor is outside [0.01, 1].</exception>
    public static TimeCoefficients[] Solve(ExpansionHistory background, IGravityModel gravity, IReadOnlyList<double> scaleFactors)
    {
        ArgumentNullException.ThrowIfNull(background);
        ArgumentNullException.ThrowIfNull(gravity);
        ArgumentNullException.ThrowIfNull(scaleFactors);
        foreach (double a in scaleFactors)
        {
            if (!(a >= 0.01 && a <= 1.0))
            {
                throw new ArgumentOutOfRangeException(nameof(scaleFactors), a, "scale factor must lie in [0.01, 1] (z <= 99)");
            }
        }

        var order = Enumerable.Range(0, scaleFactors.Count).OrderBy(i => scaleFactors[i]).ToArray();
        var results = new TimeCoefficients[scaleFactors.Count];
        var y = InitialState(InitialScaleFactor);
        var integrator = new RungeKutta4(Dimension);
        OdeRightHandSide rhs = (t, s, ds) => Derivative(background, gravity, t, s, ds);
        double t = Math.Log(InitialScaleFactor);
        foreach (int index in order)
        {
            double target = Math.Log(scaleFactors[index]);
            int steps = (int)Math.Ceiling((target - t) * StepsPerEFold);
            if (steps > 0)
            {
                integrator.Integrate(rhs, y, t, target, steps);
                t = target;
            }

            results[index] = Snapshot(Math.Exp(t), y);
        }

        return results;
    }

    /// <summary>Coefficients at one scale factor.</summary>
    public static TimeCoefficients Solve(ExpansionHistory background, IGravityModel gravity, double scaleFactor) =>
        Solve(background, gravity, [scaleFactor])[0];

    private static double[] InitialState(double a)
    {
        var y = new double[Dimension];
        double a2 = a * a, a3 = a2 * a;
        y[0] = a;
        y[1] = a;
        y[2] = -2.0 / 7.0 * a2;
        y[3] = -4.0 / 7.0 * a2;
        for (int s = 0; s < Structures; s++)
        {
            y[4 + 2 * s] = EdsDensity[s] * a3;
            y[5 + 2 * s] = (3.0 * EdsDensity[s] - EdsContinuitySource[s]) * a3;
        }

        return y;
    }

    private static void Derivative(ExpansionHistory background, IGravityModel gravity, double t, ReadOnlySpan<double> y, Span<double> dy)
    {
        double a = Math.Exp(t);
        double friction = 2.0 + background.HubbleLogSlope(a);
        double poisson = 1.5 * background.OmegaMatterAt(a) * gravity.Mu(a);
        double gamma2 = gravity.QuadraticVertex(a);
        double gamma3 = gravity.CubicVertex(a);
        double d = y[0], dp = y[1], b = y[2], bp = y[3];

        dy[0] = dp;
        dy[1] = -friction * dp + poisson * d;
        dy[2] = bp;
        dy[3] = -friction * bp + poisson * b - dp * dp + gamma2 * d * d;

        Span<double> continuity = stackalloc double[Structures];
        Span<double> euler = stackalloc double[Structures];
        continuity[(int)ThirdOrderStructure.AlphaAlpha] = dp * d * d;
        continuity[(int)ThirdOrderStructure.AlphaGamma] = d * bp;
        continuity[(int)ThirdOrderStructure.AlphaGammaOdd] = dp * b;
        euler[(int)ThirdOrderStructure.BetaAlpha] = 2.0 * dp * dp * d;
        euler[(int)ThirdOrderStructure.BetaGamma] = 2.0 * dp * bp;
        euler[(int)ThirdOrderStructure.GammaAlpha] = 2.0 * gamma2 * d * d * d;
        euler[(int)ThirdOrderStructure.GammaGamma] = 2.0 * gamma2 * d * b + gamma3 * d * d * d;
        for (int s = 0; s < Structures; s++)
        {
            double x = y[4 + 2 * s], v = y[5 + 2 * s];
            dy[4 + 2 * s] = v + continuity[s];
            dy[5 + 2 * s] = -friction * v + poisson * x + euler[s];
        }
    }

    private static TimeCoefficients Snapshot(double a, ReadOnlySpan<double> y)
    {
        var density = new double[Structures];
        var velocity = new double[Structures];
        for (int s = 0; s < Structures; s++)
        {
            density[s] = y[4 + 2 * s];
            velocity[s] = y[5 + 2 * s];
        }

        return new TimeCoefficients(a, y[0], y[1], y[2], y[3], density, velocity);
    }
}
