using Sibyl.Cosmology.Linear;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Specs;

public class ShippedGridTests
{
    private static string Folder => Path.Combine(AppContext.BaseDirectory, "training-grids");

    public static TheoryData<string> Specs() => new(Files());

    private static IEnumerable<string> Files() =>
        Directory.GetFiles(Folder, "*.json").Select(p => Path.GetFileName(p)).Order(StringComparer.Ordinal);

    [Fact]
    public void Every_shipped_spec_is_copied_for_the_tests()
    {
        // Guards the theory below against an empty glob, which would pass without reading anything.
        Assert.Contains("quickstart.json", Files());
        Assert.Contains("matter-boltzmann.json", Files());
    }

    [Theory]
    [MemberData(nameof(Specs))]
    public void Every_shipped_spec_passes_every_check(string file)
    {
        var spec = GridSpecReader.ReadFile(Path.Combine(Folder, file));

        Assert.Equal(Path.GetFileNameWithoutExtension(file), spec.Name);
    }

    [Fact]
    public void The_boltzmann_grid_trains_on_the_solver_and_stays_small()
    {
        // About half a second per point on one core with the solver: 150 points and one redshift keep plan, run, merge and fit to a few
        // minutes on 2 cores.
        var spec = GridSpecReader.ReadFile(Path.Combine(Folder, "matter-boltzmann.json"));

        Assert.True(spec.UsesBoltzmann);
        Assert.Equal(LinearSource.Boltzmann, spec.LinearSource);
        Assert.InRange(spec.TotalPoints, 100, 200);
        Assert.Equal([0.5], spec.Redshifts);
        Assert.Equal(4, spec.Varied.Count);
    }
}
