using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Cosmology.Numerics;

namespace Sibyl.Cosmology.Growth;

/// <summary>
/// Scale-independent linear growth from D'' + (2 + d ln H/d ln a) D' − (3/2) Ω_m(a) μ(a) D = 0 in ln a,
/// started at a = 1e-5 on the matter-dominated growing mode D = D' = a. No Einstein–de Sitter
/// approximation is made after the start; its error there is of order Ω_DE(1e-5) and, for nDGP,
/// μ(1e-5) − 1 ~ 1e-8.
/// </summary>
public static class LinearGrowth
{
    /// <summary>Scale factor where integration starts.</summary>
    public const double InitialScaleFactor = 1e-5;

    /// <summary>Fixed RK4 steps per unit of ln a; 200 gives better than 1e-9 relative on D.</summary>
    public const int StepsPerEFold = 200;

    /// <summary>Solves for D and f at scale factor <paramref name="a"/>.</summary>
    /// <param name="background">Expansion history.</param>
    /// <param name="gravity">Gravity model supplying μ(a).</param>
    /// <param name="a">Scale factor, in [1e-4, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="a"/> outside [1e-4, 1].</exception>
    public static GrowthState Solve(ExpansionHistory background, IGravityModel gravity, double a)
    {
        ArgumentNullException.ThrowIfNull(background);
        ArgumentNullException.ThrowIfNull(gravity);
        if (!(a >= 1e-4 && a <= 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(a), a, "scale factor must lie in [1e-4, 1]");
        }

        Span<double> y = stackalloc double[] { InitialScaleFactor, InitialScaleFactor };
        double t0 = Math.Log(InitialScaleFactor);
        double t1 = Math.Log(a);
        int steps = Math.Max(1, (int)Math.Ceiling((t1 - t0) * StepsPerEFold));
        new RungeKutta4(2).Integrate(
            (t, s, ds) =>
            {
                double at = Math.Exp(t);
                ds[0] = s[1];
                ds[1] = -(2.0 + background.HubbleLogSlope(at)) * s[1]
                        + 1.5 * background.OmegaMatterAt(at) * gravity.Mu(at) * s[0];
            },
            y, t0, t1, steps);
        return new GrowthState(a, y[0], y[1] / y[0]);
    }

    /// <summary>Solves at redshift <paramref name="z"/> in [0, 9999].</summary>
    public static GrowthState SolveAtRedshift(ExpansionHistory background, IGravityModel gravity, double z) =>
        Solve(background, gravity, 1.0 / (1.0 + z));
}
