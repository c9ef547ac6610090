using Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>Spectra at k values of the caller's choosing.</summary>
[Collection(ServerCollection.Name)]
public sealed class InterpolationTests(ServerFixture fixture)
{
    [Fact]
    public async Task Requested_k_on_the_grid_return_the_grid_values_to_round_off()
    {
        // At a knot the spline returns the knot value; exp(ln |P|) then costs a few ulps (|ln P| ≲ 10 → ≲ 1e-14).
        var grid = await fixture.Client.PredictAsync(Basis(Reference.Slices(0.12, 0.8, 0.5, cs2: 1.0)));
        int[] picked = [0, 7, 13, 59];
        var request = Basis(Reference.Slices(0.12, 0.8, 0.5, cs2: 1.0));
        request.K.Add(picked.Select(i => fixture.Slices.K[i]));
        var reply = await fixture.Client.PredictAsync(request);
        Assert.Equal(picked.Select(i => fixture.Slices.K[i]), reply.K);
        for (int j = 0; j < picked.Length; j++)
        {
            Close(grid.Observables[0].Values[picked[j]], reply.Observables[0].Values[j], 1e-13);
            for (int t = 0; t < 2; t++)
            {
                Close(grid.Terms[t].Values[picked[j]], reply.Terms[t].Values[j], 1e-13);
                Close(grid.Terms[t].Variance[picked[j]], reply.Terms[t].Variance[j], 1e-13);
            }
        }
    }

    [Fact]
    public async Task Interpolated_observables_are_assembled_from_the_interpolated_terms()
    {
        // Linearity in the nuisance parameters survives interpolation: P = T0 − 2 cs2 T1 at every requested k, to
        // round-off of one multiply-add.
        const double cs2 = 4.0;
        var request = Basis(Reference.Slices(0.105, 0.88, 1.0, cs2));
        request.K.Add([0.3, 0.0123, 0.2, 0.05, 0.05, 0.01]);
        var reply = await fixture.Client.PredictAsync(request);
        for (int j = 0; j < reply.K.Count; j++)
        {
            Close(reply.Terms[0].Values[j] - (2 * cs2 * reply.Terms[1].Values[j]), reply.Observables[0].Values[j], 1e-14);
        }

        Assert.Equal(reply.Observables[0].Values[3], reply.Observables[0].Values[4]);
    }

    [Fact]
    public async Task Interpolated_gradient_is_the_derivative_of_the_interpolated_spectrum()
    {
        // Same finite-difference budget as on the grid (see PredictionTests): 1e-6 of the largest gradient.
        double[] k = [0.0137, 0.0721, 0.1555, 0.2875];
        var centre = Reference.Slices(0.12, 0.8, 0.5, cs2: 1.5);
        centre.K.Add(k);
        centre.IncludeGradient = true;
        var reply = await fixture.Client.PredictAsync(centre);
        double h = 1e-5 * 0.18;
        var plus = Reference.Slices(0.12, 0.8 + h, 0.5, cs2: 1.5);
        var minus = Reference.Slices(0.12, 0.8 - h, 0.5, cs2: 1.5);
        plus.K.Add(k);
        minus.K.Add(k);
        var (p, m) = (await fixture.Client.PredictAsync(plus), await fixture.Client.PredictAsync(minus));
        double scale = Enumerable.Range(0, k.Length).Max(j => Math.Abs(reply.Observables[0].Gradient[(j * 2) + 1]));
        for (int j = 0; j < k.Length; j++)
        {
            double numeric = (p.Observables[0].Values[j] - m.Observables[0].Values[j]) / (2 * h);
            Assert.True(Math.Abs(numeric - reply.Observables[0].Gradient[(j * 2) + 1]) <= 1e-6 * scale, $"k = {k[j]}");
        }
    }

    private static PredictRequest Basis(PredictRequest request)
    {
        request.IncludeBasis = true;
        request.IncludeVariance = true;
        return request;
    }

    private static void Close(double expected, double actual, double relative) =>
        Assert.True(Math.Abs(expected - actual) <= relative * Math.Abs(expected), $"expected {expected:R}, got {actual:R}");
}
