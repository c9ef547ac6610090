using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Compression;

namespace Sibyl.Emulation.Tests.Compression;

public sealed class PrincipalComponentsValidationTests
{
    private static readonly PrincipalComponentsOptions Defaults = new();

    [Fact]
    public void Non_finite_data_is_rejected_naming_data()
    {
        var data = Matrix<double>.Build.Dense(4, 3, (i, f) => i + f);
        data[2, 1] = double.NaN;
        var error = Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(data, Defaults));
        Assert.Equal("data", error.ParamName);
        Assert.Contains("data[2, 1] = NaN", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_single_sample_is_rejected_naming_data()
    {
        Assert.Equal("data", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(Matrix<double>.Build.Dense(1, 3), Defaults)).ParamName);
        Assert.Equal("sampleCount", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(new double[6], 4, Defaults)).ParamName);
    }

    [Fact]
    public void Scale_of_the_wrong_length_or_not_positive_is_rejected_naming_Scale()
    {
        var data = Matrix<double>.Build.Dense(4, 3, (i, f) => i * f);
        Assert.Equal("Scale", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Scale = [1.0, 1.0] })).ParamName);
        Assert.Equal("Scale", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Scale = [1.0, 0.0, 1.0] })).ParamName);
    }

    [Fact]
    public void Negative_tolerance_or_zero_maximum_count_is_rejected_naming_options()
    {
        var data = Matrix<double>.Build.Dense(4, 3, (i, f) => i * f);
        Assert.Equal("options", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Tolerance = -1.0 })).ParamName);
        Assert.Equal("options", Assert.Throws<ArgumentException>(() => PrincipalComponents.Fit(data, new PrincipalComponentsOptions { MaximumCount = 0 })).ParamName);
    }

    [Fact]
    public void Vectors_of_the_wrong_length_are_rejected_naming_them()
    {
        var pca = PrincipalComponents.Fit(Matrix<double>.Build.Dense(5, 3, (i, f) => (i * f) + Math.Sin(i)), Defaults);
        Assert.Equal("features", Assert.Throws<ArgumentException>(() => pca.Project(new double[2], new double[pca.Count])).ParamName);
        Assert.Equal("coefficients", Assert.Throws<ArgumentException>(() => pca.Project(new double[3], new double[pca.Count + 1])).ParamName);
        Assert.Equal("features", Assert.Throws<ArgumentException>(() => pca.Reconstruct(new double[pca.Count], new double[4])).ParamName);
    }

    [Fact]
    public void Arrays_of_inconsistent_sizes_are_rejected_naming_the_array()
    {
        var error = Assert.Throws<ArgumentException>(() => PrincipalComponents.FromArrays([0.0, 0.0], [1.0, 1.0], [1.0, 0.0, 0.0], [1.0], 0.0, 0.0, 1.0));
        Assert.Equal("basis", error.ParamName);
    }
}
