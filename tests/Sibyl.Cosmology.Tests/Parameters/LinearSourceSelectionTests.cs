using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Tests.Parameters;

public class LinearSourceSelectionTests
{
    private static Dictionary<string, string> Values(params (string Name, string Value)[] pairs) =>
        pairs.ToDictionary(p => p.Name, p => p.Value, StringComparer.Ordinal);

    [Fact]
    public void Without_linear_the_source_is_the_fit()
    {
        Assert.Equal(LinearSource.Fit, ParameterCatalog.LinearSourceOf(Values(("h", "0.7"))));
    }

    [Theory]
    [InlineData("fit", LinearSource.Fit)]
    [InlineData("boltzmann", LinearSource.Boltzmann)]
    public void Each_source_name_selects_its_source_and_is_its_name(string name, LinearSource expected)
    {
        Assert.Equal(expected, ParameterCatalog.LinearSourceOf(Values(("linear", name))));
        Assert.Equal(name, ParameterCatalog.NameOf(expected));
    }

    [Theory]
    [InlineData("Boltzmann")]
    [InlineData("table")]
    [InlineData("")]
    public void An_unknown_source_is_refused_naming_the_allowed_ones(string name)
    {
        var e = Assert.Throws<ParameterOutOfRangeException>(() => ParameterCatalog.LinearSourceOf(Values(("linear", name))));

        Assert.Equal("linear", e.Name);
        Assert.Contains($"must be one of fit, boltzmann, got '{name}'", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("N_eff", null)]
    [InlineData("Y_He", null)]
    [InlineData("N_eff", "fit")]
    [InlineData("Y_He", "fit")]
    public void Solver_only_parameters_are_refused_for_the_fit(string parameter, string? source)
    {
        // The fit ignores them: accepting them would let a user believe N_eff changed the spectrum.
        var values = Values((parameter, "0.3"));
        if (source is not null)
        {
            values["linear"] = source;
        }

        var e = Assert.Throws<ParameterOutOfRangeException>(() => ParameterCatalog.LinearSourceOf(values));

        Assert.Equal(parameter, e.Name);
        Assert.Contains("applies only to linear=boltzmann", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Solver_only_parameters_reach_the_cosmology_with_the_solver()
    {
        var values = Values(("linear", "boltzmann"), ("N_eff", "2.5"), ("Y_He", "0.25"));

        var parameters = ParameterCatalog.Build(values);

        Assert.Equal(LinearSource.Boltzmann, ParameterCatalog.LinearSourceOf(values));
        Assert.Equal(2.5, parameters.NEff);
        Assert.Equal(0.25, parameters.HeliumFraction);
    }

    [Fact]
    public void Solver_only_parameters_default_to_the_standard_values()
    {
        // Mangano et al. (2005) N_eff and the BBN helium fraction, as CosmologyParameters documents them.
        var parameters = ParameterCatalog.Build(Values());

        Assert.Equal(3.046, parameters.NEff);
        Assert.Equal(0.2454, parameters.HeliumFraction);
    }

    [Theory]
    [InlineData("N_eff", "-0.1", "[0, 10]")]
    [InlineData("N_eff", "10.5", "[0, 10]")]
    [InlineData("Y_He", "0", "(0, 0.5)")]
    [InlineData("Y_He", "0.5", "(0, 0.5)")]
    public void Solver_only_parameters_are_range_checked(string name, string value, string range)
    {
        var e = Assert.Throws<ParameterOutOfRangeException>(() => ParameterCatalog.Build(Values((name, value))));

        Assert.Equal(name, e.Name);
        Assert.Contains($"must be finite and lie in {range}", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_refuses_a_record_made_in_code_with_a_solver_parameter_out_of_range()
    {
        var e = Assert.Throws<ParameterOutOfRangeException>(() => CosmologyModel.Create(new CosmologyParameters { HeliumFraction = 0.7 }));

        Assert.Equal("Y_He", e.Name);
    }

    [Fact]
    public void The_default_source_of_a_model_is_the_fit()
    {
        // Existing callers pass the parameters only; they must keep getting the fit, bit for bit.
        var parameters = new CosmologyParameters();

        var byDefault = CosmologyModel.Create(parameters);
        var fit = CosmologyModel.Create(parameters, LinearSource.Fit);

        Assert.Equal(LinearSpectrumFactory.FromFittingFormula(parameters, byDefault.LcdmGrowthToday).Source, byDefault.Linear.Source);
        Assert.Equal(fit.Linear.Shape.Values, byDefault.Linear.Shape.Values);
    }

    [Fact]
    public void A_negative_thread_count_is_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => CosmologyModel.Create(new CosmologyParameters(), LinearSource.Fit, threads: -1));
    }

    [Fact]
    public void The_boltzmann_source_is_the_solver_and_close_to_the_fit()
    {
        // The fit is good to a few per cent (Eisenstein & Hu 1998); 10 % at k = 0.1 h/Mpc leaves room for its BAO
        // phase error while catching a wrong normalisation or a table in the wrong units.
        var parameters = new CosmologyParameters();

        var solver = CosmologyModel.Create(parameters, LinearSource.Boltzmann);
        var fit = CosmologyModel.Create(parameters);

        Assert.NotEqual(fit.Linear.Source, solver.Linear.Source);
        Assert.Equal(1.0, solver.Linear.Shape.Evaluate(0.1) / fit.Linear.Shape.Evaluate(0.1), 0.1);
        Assert.Equal(LinearSpectrumFactory.DefaultKMin, solver.Linear.KMin, 1e-12);
        Assert.Equal(LinearSpectrumFactory.DefaultKMax, solver.Linear.KMax, 1e-9);
    }

    [Fact]
    public void N_eff_changes_the_solver_spectrum()
    {
        // More radiation delays matter-radiation equality and moves the turnover: the shape at k = 0.1 h/Mpc must
        // change by more than the solver's numerical noise when N_eff goes from 3.046 to 4.
        var standard = CosmologyModel.Create(new CosmologyParameters(), LinearSource.Boltzmann);
        var more = CosmologyModel.Create(new CosmologyParameters { NEff = 4.0 }, LinearSource.Boltzmann);

        double ratio = more.Linear.Shape.Evaluate(0.1) / standard.Linear.Shape.Evaluate(0.1);

        Assert.True(Math.Abs(ratio - 1.0) > 1e-3, $"ratio {ratio}");
    }
}
