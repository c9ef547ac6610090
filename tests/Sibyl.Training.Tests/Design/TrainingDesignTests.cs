using Sibyl.Training.Design;

namespace Sibyl.Training.Tests.Design;

public class TrainingDesignTests
{
    [Fact]
    public void Same_seed_gives_a_bit_identical_design_and_file()
    {
        var spec = SpecText.Spec("points={\"training\": 12, \"heldout\": 4}");
        var first = TrainingDesign.Create(spec);
        var second = TrainingDesign.Create(spec);
        using var folder = new TemporaryFolder();

        first.Save(folder.File("a.design"));
        second.Save(folder.File("b.design"));

        Assert.Equal(first.Hash, second.Hash);
        for (int i = 0; i < first.Count; i++)
        {
            Assert.True(first.Unit(i).SequenceEqual(second.Unit(i)), $"point {i} differs");
        }

        Assert.Equal(File.ReadAllBytes(folder.File("a.design")), File.ReadAllBytes(folder.File("b.design")));
    }

    [Fact]
    public void Another_seed_gives_another_design()
    {
        var first = TrainingDesign.Create(SpecText.Spec("seed=1"));
        var second = TrainingDesign.Create(SpecText.Spec("seed=2"));

        Assert.NotEqual(first.Hash, second.Hash);
        Assert.NotEqual(Strata.Block(first, 0, first.Count), Strata.Block(second, 0, second.Count));
    }

    [Theory]
    [InlineData(12, 5, 2)]
    [InlineData(25, 7, 4)]
    [InlineData(2, 3, 1)]
    public void Training_and_held_out_points_are_each_a_latin_hypercube_of_their_own(int training, int heldOut, int dimensions)
    {
        // McKay et al. (1979): the strata property on each block alone (n = training, then n = held out). The
        // union is not one Latin hypercube, and need not be: the held-out points test the emulator in between.
        string[] names = ["omega_cdm", "h", "n_s", "sigma8"];
        string[] ranges = ["[0.11, 0.13]", "[0.65, 0.70]", "[0.94, 0.99]", "[0.7, 0.9]"];
        string vary = "{" + string.Join(", ", Enumerable.Range(0, dimensions).Select(c => $"\"{names[c]}\": {ranges[c]}")) + "}";
        var spec = SpecText.Spec($"vary={vary}", $"points={{\"training\": {training}, \"heldout\": {heldOut}}}");

        var design = TrainingDesign.Create(spec);

        Assert.Equal(training + heldOut, design.Count);
        Strata.AssertOnePointPerStratum(Strata.Block(design, 0, training), training, dimensions);
        Strata.AssertOnePointPerStratum(Strata.Block(design, training, training + heldOut), heldOut, dimensions);
        Assert.True(design.IsTraining(training - 1));
        Assert.False(design.IsTraining(training));
    }

    [Fact]
    public void Maximin_improvement_of_a_design_never_raises_phi_p()
    {
        // The criterion of Morris & Mitchell (1995) before and after, as stored with the design.
        var design = TrainingDesign.Create(SpecText.Spec("points={\"training\": 30, \"heldout\": 0}"));

        Assert.True(design.CriterionAfter <= design.CriterionBefore, $"{design.CriterionBefore} -> {design.CriterionAfter}");

        // Recomputed from the stored points; only the summation order differs: 1e-12 relative.
        var training = Strata.Block(design, 0, 30);
        Assert.Equal(MaximinImprovement.Criterion(training, 30, 2), design.CriterionAfter, design.CriterionAfter * 1e-12);

        // Against the definition computed independently (square root and Math.Pow, not the library's repeated
        // multiplication): a few 1e-16 per term over 435 positive terms, shrunk by the 1/20 power; 1e-12 relative.
        Assert.Equal(MorrisMitchell.Phi(training, 30, 2, MaximinImprovement.Exponent), design.CriterionAfter, design.CriterionAfter * 1e-12);
    }

    [Fact]
    public void Points_map_the_unit_cube_onto_the_box()
    {
        var design = TrainingDesign.Create(SpecText.Spec());

        for (int i = 0; i < design.Count; i++)
        {
            var unit = design.Unit(i);
            var point = design.Point(i);

            // omega_cdm in [0.11, 0.13] and h in [0.65, 0.70] of SpecText.Base: min + u (max − min); the code rounds
            // max − min once, this line uses the decimal width, so they differ by ~1e-16: 1e-15 absolute.
            Assert.Equal(0.11 + (unit[0] * 0.02), point[0], 1e-15);
            Assert.Equal(0.65 + (unit[1] * 0.05), point[1], 1e-15);
        }
    }

    [Fact]
    public void Chunks_cover_every_point_once_and_the_last_may_be_short()
    {
        // 6 + 2 points in chunks of 3: [0, 3), [3, 6), [6, 8).
        var design = TrainingDesign.Create(SpecText.Spec("chunk_size=3"));

        Assert.Equal(3, design.ChunkCount);
        Assert.Equal((0, 3), design.ChunkRange(0));
        Assert.Equal((3, 6), design.ChunkRange(1));
        Assert.Equal((6, 8), design.ChunkRange(2));
    }
}
