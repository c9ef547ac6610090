using Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>Unary predictions through the client against the same emulator evaluated in process.</summary>
[Collection(ServerCollection.Name)]
public sealed class PredictionTests(ServerFixture fixture)
{
    [Fact]
    public async Task Unary_prediction_equals_the_in_process_emulator_bit_for_bit()
    {
        // The server runs the same predictor and assembles the observable in the same order as BasisSpectra.Assemble,
        // so no tolerance: any difference would mean it computed something else.
        var request = Reference.Slices(0.115, 0.83, 1.0, cs2: 1.7);
        request.IncludeBasis = true;
        request.IncludeVariance = true;
        request.IncludeGradient = true;
        var reply = await fixture.Client.PredictAsync(request);
        var expected = new Reference(fixture.Slices, [0.115, 0.83], slice: 1, new Dictionary<string, double> { ["cs2"] = 1.7 });

        int nk = fixture.Slices.K.Count, d = 2;
        Assert.Equal(fixture.Slices.K, reply.K);
        Assert.False(reply.Extrapolated);
        Assert.Equal(["omega_cdm", "sigma8"], reply.GradientParameters);
        Assert.Equal("P", Assert.Single(reply.Observables).Name);
        Assert.Equal(expected.Observables[0], reply.Observables[0].Values);
        Assert.Equal(["P_tree_plus_loop", "P_ct_basis"], reply.Terms.Select(t => t.Name));
        for (int t = 0; t < 2; t++)
        {
            Assert.Equal(expected.Terms.AsSpan(t * nk, nk).ToArray(), reply.Terms[t].Values);
            Assert.Equal(expected.Variance.AsSpan(t * nk, nk).ToArray(), reply.Terms[t].Variance);
            Assert.Equal(expected.Gradient.AsSpan(t * nk * d, nk * d).ToArray(), reply.Terms[t].Gradient);
        }
    }

    [Fact]
    public async Task Observable_variance_and_gradient_combine_the_terms_with_their_coefficients()
    {
        // P = T0 − 2 cs2 T1: var P = var T0 + (2 cs2)² var T1 (independent processes), ∇P = ∇T0 − 2 cs2 ∇T1.
        // Only the order of two additions differs from the direct sum, so 1e-13 relative is round-off.
        const double cs2 = -3.0;
        var request = Reference.Slices(0.13, 0.75, 0.5, cs2);
        request.IncludeBasis = request.IncludeVariance = request.IncludeGradient = true;
        var reply = await fixture.Client.PredictAsync(request);
        var p = reply.Observables[0];
        var (t0, t1) = (reply.Terms[0], reply.Terms[1]);
        double c1 = -2.0 * cs2;
        for (int i = 0; i < reply.K.Count; i++)
        {
            Close(t0.Variance[i] + (c1 * c1 * t1.Variance[i]), p.Variance[i], 1e-13);
            for (int q = 0; q < 2; q++)
            {
                int at = (i * 2) + q;
                double bound = 1e-13 * (Math.Abs(t0.Gradient[at]) + Math.Abs(c1 * t1.Gradient[at]));
                Assert.True(Math.Abs(t0.Gradient[at] + (c1 * t1.Gradient[at]) - p.Gradient[at]) <= bound, $"k index {i}, parameter {q}");
            }
        }
    }

    [Fact]
    public async Task Gradient_matches_central_differences_of_the_served_spectrum()
    {
        // The gradient is the exact derivative of the emulator's mean. Central differences with a step of 1e-5 of
        // the box width have a truncation error ~ (step² / 6) |P'''| ≪ 1e-7 of P for a smooth GP, and round-off
        // ~ 1e-16 P / 1e-5 ≈ 1e-11 P, so 1e-6 relative to the largest gradient over k is generous.
        double[] at = [0.12, 0.8];
        double[] width = [0.04, 0.18];
        var centre = Reference.Slices(at[0], at[1], 0.5, cs2: 2.0);
        centre.IncludeGradient = true;
        var reply = await fixture.Client.PredictAsync(centre);
        for (int q = 0; q < 2; q++)
        {
            double h = 1e-5 * width[q];
            double[] up = [.. at], down = [.. at];
            up[q] += h;
            down[q] -= h;
            var plus = await fixture.Client.PredictAsync(Reference.Slices(up[0], up[1], 0.5, 2.0));
            var minus = await fixture.Client.PredictAsync(Reference.Slices(down[0], down[1], 0.5, 2.0));
            double scale = Enumerable.Range(0, reply.K.Count).Max(i => Math.Abs(reply.Observables[0].Gradient[(i * 2) + q]));
            for (int i = 0; i < reply.K.Count; i++)
            {
                double numeric = (plus.Observables[0].Values[i] - minus.Observables[0].Values[i]) / (2 * h);
                Assert.True(Math.Abs(numeric - reply.Observables[0].Gradient[(i * 2) + q]) <= 1e-6 * scale, $"k index {i}, parameter {q}");
            }
        }
    }

    [Fact]
    public async Task Missing_nuisance_parameters_count_as_zero()
    {
        // Exact: a zero coefficient drops the term, as in BasisSpectra.Assemble.
        var without = await fixture.Client.PredictAsync(Reference.Slices(0.12, 0.8, 0.5));
        var withZero = await fixture.Client.PredictAsync(Reference.Slices(0.12, 0.8, 0.5, cs2: 0.0));
        var request = Reference.Slices(0.12, 0.8, 0.5);
        request.IncludeBasis = true;
        var basis = await fixture.Client.PredictAsync(request);
        Assert.Equal(withZero.Observables[0].Values, without.Observables[0].Values);
        Assert.Equal(basis.Terms[0].Values, without.Observables[0].Values);
    }

    [Fact]
    public async Task An_emulator_with_z_as_input_takes_z_among_the_parameters()
    {
        var request = new PredictRequest { Emulator = "zin" };
        request.Parameters.Add(new Dictionary<string, double> { ["sigma8"] = 0.8, ["z"] = 0.6 });
        var reply = await fixture.Client.PredictAsync(request);
        var expected = new Reference(fixture.RedshiftInput, [0.8, 0.6], slice: 0);
        Assert.Equal(expected.Observables[0], reply.Observables[0].Values);
    }

    [Fact]
    public async Task Extrapolation_is_allowed_only_when_asked_and_then_flagged()
    {
        // sigma8 = 0.91 lies 0.01 beyond the box's upper edge 0.90.
        var request = Reference.Slices(0.12, 0.91, 0.5);
        request.AllowExtrapolation = true;
        var reply = await fixture.Client.PredictAsync(request);
        Assert.True(reply.Extrapolated);
        Assert.All(reply.Observables[0].Values, v => Assert.True(double.IsFinite(v)));
        Assert.Equal(new Reference(fixture.Slices, [0.12, 0.91], 0).Observables[0], reply.Observables[0].Values);
        Assert.False((await fixture.Client.PredictAsync(Reference.Slices(0.12, 0.9, 0.5))).Extrapolated);
    }

    [Fact]
    public async Task Blocking_prediction_equals_the_asynchronous_one()
    {
        var request = Reference.Slices(0.11, 0.74, 1.0, cs2: 0.5);
        Assert.Equal(await fixture.Client.PredictAsync(request), fixture.Client.Predict(request));
    }

    private static void Close(double expected, double actual, double relative) =>
        Assert.True(Math.Abs(expected - actual) <= relative * Math.Abs(expected), $"expected {expected:R}, got {actual:R}");
}
