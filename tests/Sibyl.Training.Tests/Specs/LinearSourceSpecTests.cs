using System.Globalization;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.Matter;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Tests.Specs;

public class LinearSourceSpecTests
{
    private const string Solver = "linear=\"boltzmann\"";

    [Fact]
    public void Without_linear_every_point_uses_the_fit()
    {
        var spec = SpecText.Spec();

        Assert.Equal(LinearSource.Fit, spec.LinearSource);
        Assert.Null(spec.Linear);
        Assert.False(spec.UsesBoltzmann);
    }

    [Theory]
    [InlineData("\"fit\"", LinearSource.Fit)]
    [InlineData("\"boltzmann\"", LinearSource.Boltzmann)]
    public void A_built_in_source_is_named_by_a_string(string value, LinearSource expected)
    {
        var spec = SpecText.Spec($"linear={value}");

        Assert.Equal(expected, spec.LinearSource);
        Assert.Null(spec.Linear);
        Assert.Equal(expected == LinearSource.Boltzmann, spec.UsesBoltzmann);
    }

    [Fact]
    public void Linear_fit_is_the_same_spec_as_no_linear()
    {
        // Specs written before the solver existed must keep their hash, and saying the default aloud changes nothing.
        var implicitFit = SpecText.Spec();
        var explicitFit = SpecText.Spec("linear=\"fit\"");

        Assert.Equal(GridSpecJson.Write(implicitFit), GridSpecJson.Write(explicitFit));
        Assert.DoesNotContain("\"linear\"", GridSpecJson.Write(explicitFit), StringComparison.Ordinal);
    }

    [Fact]
    public void The_solver_enters_the_canonical_json_and_hash()
    {
        // Different hashes mean different designs, and merge refuses chunks of another design: a set trained on
        // the solver never mixes with one trained on the fit.
        var fit = SpecText.Spec();
        var solver = SpecText.Spec(Solver);
        string canonical = GridSpecJson.Write(solver);

        var again = GridSpecReader.Parse(canonical, "canonical");

        Assert.NotEqual(GridSpecJson.Hash(fit), GridSpecJson.Hash(solver));
        Assert.Contains("\"linear\": \"boltzmann\"", canonical, StringComparison.Ordinal);
        Assert.Equal(LinearSource.Boltzmann, again.LinearSource);
        Assert.Equal(GridSpecJson.Hash(solver), GridSpecJson.Hash(again));
        Assert.NotEqual(TrainingDesign.Create(fit).Hash, TrainingDesign.Create(solver).Hash);
    }

    [Theory]
    [InlineData("linear=\"sh\"", "linear: must be one of \"fit\", \"boltzmann\" (built-in sources) or an object {\"command\"")]
    [InlineData("linear=\"Boltzmann\"", "got \"Boltzmann\"")]
    [InlineData("linear=3", "linear: must be one of \"fit\", \"boltzmann\"")]
    [InlineData("linear=[\"boltzmann\"]", "linear: must be one of \"fit\", \"boltzmann\"")]
    [InlineData("vary.N_eff=[2.5, 3.5]", "vary.N_eff: is read only by the Boltzmann solver; set \"linear\": \"boltzmann\" or leave it out")]
    [InlineData("fixed.Y_He=0.25", "fixed.Y_He: is read only by the Boltzmann solver")]
    [InlineData("fixed.Y_He=0.25|linear=\"fit\"", "fixed.Y_He: is read only by the Boltzmann solver")]
    [InlineData("fixed.N_eff=3|linear={\"command\": [\"x\"]}", "fixed.N_eff: is read only by the Boltzmann solver")]
    [InlineData("linear=\"boltzmann\"|vary.Y_He=[0.2, 0.5]", "vary.Y_He: range [0.2, 0.5] leaves the allowed range (0, 0.5)")]
    [InlineData("linear=\"boltzmann\"|fixed.N_eff=-1", "fixed.N_eff: -1 is outside the allowed range [0, 10]")]
    [InlineData("linear=\"boltzmann\"|k={\"values\": [0.1, 20]}", "k[1]: 20 h/Mpc is outside [0.0001, 10]")]
    [InlineData("linear=\"boltzmann\"|k={\"values\": [5e-5, 0.1]}", "k[0]: 5E-05 h/Mpc is outside [0.0001, 10]")]
    [InlineData("linear=\"boltzmann\"|vary.h=[0.3, 0.31]|fixed.omega_b=0.0001|vary.omega_cdm=[0.05, 0.08989]", "matter and radiation exceed the critical density")]
    public void Each_invalid_linear_choice_is_refused_with_a_problem_naming_its_field(string edits, string problem)
    {
        var e = Assert.Throws<GridSpecException>(() => GridSpecReader.Parse(SpecText.With(edits.Split('|')), "grid.json"));

        Assert.Contains(e.Problems, p => p.Contains(problem, StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(3e-4, true)]
    [InlineData(2.99e-4, false)]
    public void A_k_at_the_loop_bound_gets_the_same_verdict_from_the_spec_check_and_the_run_plans(double kFirst, bool accepted)
    {
        // The case is only meaningful because 3e-5 · 10 rounds to 3.0000000000000003e-4, above the 3e-4 written in the grid.
        const double kMin = 3e-5, kMax = 50;
        Assert.True(kMin * LoopQuadrature.RangeMargin > 3e-4);
        string[] edits =
        [
            string.Create(CultureInfo.InvariantCulture, $"linear={{\"command\": [\"unused\"], \"k_min\": {kMin:R}, \"k_max\": {kMax:R}}}"),
            string.Create(CultureInfo.InvariantCulture, $"k={{\"values\": [{kFirst:R}, 0.1]}}"),
        ];

        bool specAccepts = Accepts(() => SpecText.Spec(edits));
        bool plansAccept = Accepts(() => new OneLoopMatter([kFirst, 0.1], kMin, kMax));

        Assert.Equal(accepted, specAccepts);
        Assert.Equal(accepted, plansAccept);
        if (accepted)
        {
            // The run builds its plans from the spec exactly as here; this is where the refusal used to surface.
            _ = new PointCalculator(TrainingDesign.Create(SpecText.Spec(edits)));
        }
    }

    [Fact]
    public void The_solver_table_spans_the_fit_range_so_the_same_k_limits_apply()
    {
        // The solver tabulates 1e-5 to 100 h/Mpc like the fit; the loops need k a factor 10 inside: [1e-4, 10].
        var spec = SpecText.Spec(Solver, "k={\"values\": [1e-4, 10]}");

        Assert.Equal(LinearSpectrumFactory.DefaultKMin, spec.LinearKMin);
        Assert.Equal(LinearSpectrumFactory.DefaultKMax, spec.LinearKMax);
    }

    [Fact]
    public void With_the_solver_N_eff_and_Y_He_can_be_varied_and_fixed_and_reach_each_point()
    {
        var spec = SpecText.Spec(Solver, "vary.N_eff=[2.5, 3.5]", "fixed.Y_He=0.24");
        var design = TrainingDesign.Create(spec);

        var point = design.Point(0);
        var parameters = GridPoint.Cosmology(spec, point);

        Assert.Equal("N_eff", spec.Varied[2].Name);
        Assert.InRange(point[2], 2.5, 3.5);
        Assert.Equal(point[2], parameters.NEff);
        Assert.Equal(0.24, parameters.HeliumFraction);
    }

    [Fact]
    public void A_solver_point_is_the_direct_calculation_on_the_solver_spectrum()
    {
        // The run and `sibyl compute matter linear=boltzmann` must be one calculation; the solver on one thread
        // (training) and on all cores (direct) may differ only by rounding, hence 1e-9.
        var spec = SpecText.Spec(Solver, "points={\"training\": 2, \"heldout\": 0}");
        var design = TrainingDesign.Create(spec);
        var parameters = GridPoint.Cosmology(spec, design.Point(0));

        var values = new PointCalculator(design).Compute(0, CancellationToken.None);
        var direct = new OneLoopMatter([.. spec.K]).Compute(CosmologyModel.Create(parameters, LinearSource.Boltzmann), spec.Redshifts[0]);
        var fit = new PointCalculator(TrainingDesign.Create(spec with { LinearSource = LinearSource.Fit })).Compute(0, CancellationToken.None);

        var expected = direct.Basis.Term(MatterLayout.TreePlusLoop);
        int offset = MatterLayout.TreePlusLoop * spec.K.Count;
        for (int i = 0; i < spec.K.Count; i++)
        {
            Assert.Equal(1.0, values[offset + i] / expected[i], 1e-9);
        }

        Assert.NotEqual(fit[offset], values[offset]);
    }

    private static bool Accepts(Action build)
    {
        try
        {
            build();
            return true;
        }
        catch (Exception e) when (e is GridSpecException or ArgumentException)
        {
            return false;
        }
    }
}
