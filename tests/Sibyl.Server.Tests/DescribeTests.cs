namespace Sibyl.Server.Tests;

/// <summary>Describe tells a sampler everything it needs to build requests.</summary>
[Collection(ServerCollection.Name)]
public sealed class DescribeTests(ServerFixture fixture)
{
    [Fact]
    public async Task Describe_lists_every_emulator_with_its_parameters_slices_terms_k_grid_and_accuracy()
    {
        var all = await fixture.Client.DescribeAsync();
        Assert.Equal(["slices", "zin"], all.Select(e => e.Name));
        var d = all[0];
        var e = fixture.Slices;
        Assert.Equal(["omega_cdm", "sigma8"], d.Parameters.Select(p => p.Name));
        Assert.Equal([0.10, 0.72], d.Parameters.Select(p => p.Min));
        Assert.Equal([0.14, 0.90], d.Parameters.Select(p => p.Max));
        Assert.Equal([0.5, 1.0], d.Redshifts);
        Assert.Equal(["P"], d.Observables);
        Assert.Equal(["cs2"], d.Nuisance);
        Assert.Equal(["P_tree_plus_loop", "P_ct_basis"], d.Terms.Select(t => t.Name));
        Assert.Equal([1.0, -2.0], d.Terms.Select(t => t.Prefactor));
        Assert.Equal(["cs2"], d.Terms[1].NuisanceFactors);
        Assert.All(d.Terms, t => Assert.Equal("P", t.Observable));
        Assert.Equal(e.K, d.K);
        Assert.True(d.HasVariance);
        Assert.Equal(40, d.TrainingPoints);
        Assert.Equal(e.Accuracy.Source, d.AccuracySource);
        Assert.Equal(e.Accuracy.Points, d.AccuracyPoints);
        for (int t = 0; t < 2; t++)
        {
            Assert.Equal(e.Accuracy.Worst99(t), d.Accuracy[t].WorstP99);
            Assert.Equal(e.Accuracy.Curve(t, 99).ToArray(), d.Accuracy[t].P99);
            Assert.Equal(e.Accuracy.IsRelative(t), d.Accuracy[t].Relative);
        }

        Assert.Empty(all[1].Redshifts);
        Assert.False(all[1].HasVariance);
    }

    [Fact]
    public async Task Describe_of_one_emulator_returns_only_it()
    {
        Assert.Equal(["sigma8", "z"], (await fixture.Client.DescribeAsync("zin")).Parameters.Select(p => p.Name));
    }
}
