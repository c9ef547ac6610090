extern alias server;

using server::Sibyl.Server.Internal;

namespace Sibyl.Server.Tests;

/// <summary>The spline behind requested k values, checked on its own and on an emulated spectrum.</summary>
[Collection(ServerCollection.Name)]
public sealed class KnotSplineTests(ServerFixture fixture)
{
    [Fact]
    public void Not_a_knot_spline_reproduces_a_cubic_exactly_on_an_uneven_grid()
    {
        // A not-a-knot spline is exact for cubics (de Boor 1978, ch. IV); what remains is round-off of the
        // tridiagonal solve, ~1e-13 of the values here.
        double[] x = [-4.0, -3.1, -2.9, -2.0, -1.2, 0.0, 0.4, 1.5];
        static double Cubic(double v) => 2.0 - (0.5 * v) + (0.3 * v * v) - (0.07 * v * v * v);
        var spline = new KnotSpline(x);
        double[] at = [-4.0, -3.5, -2.95, -0.6, 0.39, 1.2, 1.5];
        var result = Evaluate(spline, [.. x.Select(Cubic)], at);
        for (int j = 0; j < at.Length; j++)
        {
            Assert.Equal(Cubic(at[j]), result[j], 1e-12);
        }
    }

    [Fact]
    public void Spline_of_ln_P_in_ln_k_at_twice_the_grid_spacing_reproduces_the_skipped_grid_points_of_an_emulated_spectrum()
    {
        // The server's rule for a positive term: spline ln P in ln k. Dropping every other grid point (so the knots
        // are twice as far apart as the server's) and interpolating back to the dropped ones measures the error at
        // double spacing; a cubic spline's error falls as spacing⁴, so at the server's own spacing it is ~16 times
        // smaller. The bound 2e-3 at double spacing (measured: see the message) thus means ≲ 1e-4 on the emulator's
        // grid, a tenth of DESIGN.md's 0.1 % emulation target, BAO wiggles included.
        var e = fixture.Slices;
        var values = new double[2 * e.K.Count];
        e.CreatePredictor().Predict([0.12, 0.8], 0, values, [], []);
        int nk = e.K.Count;
        var knots = Enumerable.Range(0, nk).Where(i => i % 2 == 0 || i == nk - 1).ToArray();
        var skipped = Enumerable.Range(0, nk).Except(knots).ToArray();
        var spline = new KnotSpline([.. knots.Select(i => Math.Log(e.K[i]))]);
        double worst = 0.0;
        for (int t = 0; t < 2; t++)
        {
            var lnP = knots.Select(i => Math.Log(values[(t * nk) + i])).ToArray();
            var result = Evaluate(spline, lnP, [.. skipped.Select(i => Math.Log(e.K[i]))]);
            for (int j = 0; j < skipped.Length; j++)
            {
                double exact = values[(t * nk) + skipped[j]];
                worst = Math.Max(worst, Math.Abs((Math.Exp(result[j]) / exact) - 1.0));
            }
        }

        Assert.True(worst < 2e-3, $"largest relative error {worst:G3}");
    }

    private static double[] Evaluate(KnotSpline spline, double[] y, double[] at)
    {
        var points = at.Select(spline.Locate).ToArray();
        var result = new double[at.Length];
        spline.Evaluate(y, points, new double[spline.Count], result);
        return result;
    }
}
