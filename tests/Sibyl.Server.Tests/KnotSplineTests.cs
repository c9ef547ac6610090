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
    public void Spline_of_ln_P_in_ln_k_on_every_other_grid_point_reproduces_the_skipped_points_of_an_emulated_spectrum_to_0_4_percent()
    {
        // The server's rule for a positive term: spline ln P in ln k. Dropping every other point of the fixture's
        // 60-point grid over [0.01, 0.3] h/Mpc and interpolating back to the dropped ones measures the error of a
        // 30-point grid. The worst case is in the BAO wiggles near k ≈ 0.17 h/Mpc: 2.7e-3 measured here (it was 2.0e-2
        // for 15 points, so the error falls ~8x per halving of the spacing there), bound 4e-3. On the server's own
        // 60-point grid it is therefore a few 1e-4: grids meant for interpolation need ≳ 60 log-spaced k over this range.
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

        Assert.True(worst < 4e-3, $"largest relative error {worst:G3}");
    }

    private static double[] Evaluate(KnotSpline spline, double[] y, double[] at)
    {
        var points = at.Select(spline.Locate).ToArray();
        var result = new double[at.Length];
        spline.Evaluate(y, points, new double[spline.Count], result);
        return result;
    }
}
