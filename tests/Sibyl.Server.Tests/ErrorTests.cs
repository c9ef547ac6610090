using Grpc.Core;
using Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>Every refusal arrives with its status code and a message naming what was wrong; none breaks the server.</summary>
[Collection(ServerCollection.Name)]
public sealed class ErrorTests(ServerFixture fixture)
{
    [Fact]
    public async Task A_parameter_outside_the_box_is_OUT_OF_RANGE_naming_it_and_its_range()
    {
        var e = await Refused(StatusCode.OutOfRange, Reference.Slices(0.12, 0.95, 0.5));
        Assert.Contains("sigma8", e.Status.Detail, StringComparison.Ordinal);
        Assert.Contains("[0.72, 0.9]", e.Status.Detail, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    public async Task A_non_finite_parameter_is_INVALID_ARGUMENT_naming_it_and_its_range(double value)
    {
        var e = await Refused(StatusCode.InvalidArgument, Reference.Slices(value, 0.8, 0.5));
        Assert.Contains("omega_cdm", e.Status.Detail, StringComparison.Ordinal);
        Assert.Contains("[0.1, 0.14]", e.Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_missing_parameter_is_INVALID_ARGUMENT_listing_what_the_emulator_needs()
    {
        var request = Reference.Slices(0.12, 0.8, 0.5);
        request.Parameters.Remove("sigma8");
        var e = await Refused(StatusCode.InvalidArgument, request);
        Assert.StartsWith("sigma8: missing", e.Status.Detail, StringComparison.Ordinal);
        Assert.Contains("sigma8 in [0.72, 0.9]", e.Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_unknown_parameter_is_INVALID_ARGUMENT()
    {
        var request = Reference.Slices(0.12, 0.8, 0.5);
        request.Parameters.Add("h", 0.7);
        Assert.StartsWith("h: unknown parameter", (await Refused(StatusCode.InvalidArgument, request)).Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Unknown_or_non_finite_nuisance_values_are_INVALID_ARGUMENT()
    {
        var unknown = Reference.Slices(0.12, 0.8, 0.5, cs2: 1.0);
        unknown.Nuisance.Add("b1", 2.0);
        Assert.StartsWith("b1: unknown nuisance", (await Refused(StatusCode.InvalidArgument, unknown)).Status.Detail, StringComparison.Ordinal);
        Assert.StartsWith("cs2:", (await Refused(StatusCode.InvalidArgument, Reference.Slices(0.12, 0.8, 0.5, double.NaN))).Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_empty_request_is_INVALID_ARGUMENT()
    {
        Assert.StartsWith("emulator: required", (await Refused(StatusCode.InvalidArgument, new PredictRequest())).Status.Detail, StringComparison.Ordinal);
        Assert.Equal(StatusCode.InvalidArgument, (await Assert.ThrowsAsync<RpcException>(() => fixture.Client.PredictBatchAsync([new PredictRequest()]))).StatusCode);
    }

    [Fact]
    public async Task An_unknown_emulator_is_NOT_FOUND()
    {
        var e = await Refused(StatusCode.NotFound, new PredictRequest { Emulator = "nope" });
        Assert.Contains("slices, zin", e.Status.Detail, StringComparison.Ordinal);
        Assert.Equal(StatusCode.NotFound, (await Assert.ThrowsAsync<RpcException>(() => fixture.Client.DescribeAsync("nope"))).StatusCode);
    }

    [Fact]
    public async Task Redshift_errors_are_refused_with_the_trained_redshifts()
    {
        var missing = Reference.Slices(0.12, 0.8, 0.5);
        missing.ClearZ();
        Assert.Contains("z = 0.5, 1", (await Refused(StatusCode.InvalidArgument, missing)).Status.Detail, StringComparison.Ordinal);
        Assert.Contains("z = 0.5, 1", (await Refused(StatusCode.OutOfRange, Reference.Slices(0.12, 0.8, 0.7))).Status.Detail, StringComparison.Ordinal);
        await Refused(StatusCode.InvalidArgument, Reference.Slices(0.12, 0.8, double.NaN));
        var fixedZ = new PredictRequest { Emulator = "zin", Z = 0.5 };
        fixedZ.Parameters.Add(new Dictionary<string, double> { ["sigma8"] = 0.8, ["z"] = 0.5 });
        await Refused(StatusCode.InvalidArgument, fixedZ);
    }

    [Fact]
    public async Task Variance_of_an_emulator_fitted_without_it_is_INVALID_ARGUMENT()
    {
        var request = new PredictRequest { Emulator = "zin", IncludeVariance = true };
        request.Parameters.Add(new Dictionary<string, double> { ["sigma8"] = 0.8, ["z"] = 0.5 });
        Assert.StartsWith("include_variance", (await Refused(StatusCode.InvalidArgument, request)).Status.Detail, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(-0.1, StatusCode.InvalidArgument)]
    [InlineData(0.0, StatusCode.InvalidArgument)]
    [InlineData(double.NaN, StatusCode.InvalidArgument)]
    [InlineData(double.PositiveInfinity, StatusCode.InvalidArgument)]
    [InlineData(0.005, StatusCode.OutOfRange)]
    [InlineData(0.31, StatusCode.OutOfRange)]
    public async Task Bad_requested_k_values_are_refused(double k, StatusCode code)
    {
        var request = Reference.Slices(0.12, 0.8, 0.5);
        request.K.Add([0.1, k]);
        Assert.StartsWith("k[1]", (await Refused(code, request)).Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_huge_k_list_is_refused_and_the_server_keeps_answering()
    {
        var request = Reference.Slices(0.12, 0.8, 0.5);
        request.K.Add(Enumerable.Repeat(0.1, ServerFixture.MaxKValues + 1));
        await Refused(StatusCode.InvalidArgument, request);
        Assert.NotEmpty((await fixture.Client.PredictAsync(Reference.Slices(0.12, 0.8, 0.5))).Observables);
    }

    [Fact]
    public async Task A_batch_over_the_limit_is_RESOURCE_EXHAUSTED()
    {
        var points = Enumerable.Range(0, ServerFixture.MaxBatch + 1).Select(_ => Reference.Slices(0.12, 0.8, 0.5));
        var e = await Assert.ThrowsAsync<RpcException>(() => fixture.Client.PredictBatchAsync(points));
        Assert.Equal(StatusCode.ResourceExhausted, e.StatusCode);
        Assert.Contains($"at most {ServerFixture.MaxBatch}", e.Status.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_bad_point_in_a_batch_fails_the_call_naming_the_first_bad_point()
    {
        // 300 points span several parallel chunks; the reply names the lowest bad index whichever chunk ran first.
        var points = Enumerable.Range(0, 300).Select(i => Reference.Slices(0.12, i is 130 or 290 ? 0.99 : 0.8, 0.5)).ToList();
        var e = await Assert.ThrowsAsync<RpcException>(() => fixture.Client.PredictBatchAsync(points));
        Assert.Equal(StatusCode.OutOfRange, e.StatusCode);
        Assert.StartsWith("point 130: sigma8", e.Status.Detail, StringComparison.Ordinal);
    }

    private async Task<RpcException> Refused(StatusCode code, PredictRequest request)
    {
        var e = await Assert.ThrowsAsync<RpcException>(() => fixture.Client.PredictAsync(request));
        Assert.Equal(code, e.StatusCode);
        return e;
    }
}
