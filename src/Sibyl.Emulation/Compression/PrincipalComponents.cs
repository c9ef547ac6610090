using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Emulation.Compression;

/// <summary>
/// A truncated principal-component basis of a set of feature vectors (for example one block of transformed
/// spectra over the k grid): x ≈ m + s ⊙ Σ_c a_c v_c, with m the per-feature mean, s the per-feature scale and
/// v_c orthonormal components ordered by decreasing singular value.
/// </summary>
/// <remarks>
/// Built by <see cref="Fit(Matrix{double}, PrincipalComponentsOptions)"/> (Jolliffe 2002, "Principal Component
/// Analysis", 2nd ed., Springer, ch. 1–3: the components are the right singular vectors of the centred data) or
/// rebuilt bit-exactly from its plain arrays by <see cref="FromArrays"/>. Immutable and safe to share between threads.
/// </remarks>
public sealed partial class PrincipalComponents
{
    private readonly double[] _mean;
    private readonly double[] _scale;
    private readonly double[] _basis;
    private readonly double[] _singularValues;

    private PrincipalComponents(
        double[] mean, double[] scale, double[] basis, double[] singularValues, double maximumError, double rmsError, double explained)
    {
        _mean = mean;
        _scale = scale;
        _basis = basis;
        _singularValues = singularValues;
        MaximumError = maximumError;
        RmsError = rmsError;
        ExplainedFraction = explained;
    }

    /// <summary>Number of features (length of a data vector).</summary>
    public int FeatureCount => _mean.Length;

    /// <summary>Number of kept components (length of a coefficient vector), at least 1.</summary>
    public int Count => _singularValues.Length;

    /// <summary>Per-feature mean m of the training data, in feature units.</summary>
    public ReadOnlySpan<double> Mean => _mean;

    /// <summary>Per-feature scale s (positive), in feature units; all 1 when the fit was given none.</summary>
    public ReadOnlySpan<double> Scale => _scale;

    /// <summary>The kept components, component-major: row c (length <see cref="FeatureCount"/>) is v_c. Rows are orthonormal.</summary>
    public ReadOnlySpan<double> Basis => _basis;

    /// <summary>
    /// Singular values of the standardized training data for the kept components, decreasing. The coefficient
    /// a_c of the training samples has root-mean-square σ_c/√n over the n samples.
    /// </summary>
    public ReadOnlySpan<double> SingularValues => _singularValues;

    /// <summary>Largest |x − x̂| over training samples and features, in standardized units (see <see cref="PrincipalComponentsOptions.Tolerance"/>).</summary>
    public double MaximumError { get; }

    /// <summary>Root-mean-square of x − x̂ over training samples and features, in standardized units.</summary>
    public double RmsError { get; }

    /// <summary>Fraction of the standardized training variance carried by the kept components (Σ kept σ² / Σ all σ²), in [0, 1].</summary>
    public double ExplainedFraction { get; }

    /// <summary>Component <paramref name="index"/> (orthonormal, length <see cref="FeatureCount"/>).</summary>
    /// <param name="index">0 ≤ index &lt; <see cref="Count"/>.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="index"/> is outside the kept components.</exception>
    public ReadOnlySpan<double> Component(int index)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(index);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(index, Count);
        return _basis.AsSpan(index * FeatureCount, FeatureCount);
    }

    /// <summary>Rebuilds a basis from the arrays exposed by a fitted one (for a file layer); the arrays are copied.</summary>
    /// <param name="mean">Per-feature mean, all finite.</param>
    /// <param name="scale">Per-feature scale, same length, all finite and positive.</param>
    /// <param name="basis">Component-major basis, a whole number (at least 1) of rows of the feature length, all finite.</param>
    /// <param name="singularValues">One finite non-negative value per component.</param>
    /// <param name="maximumError">The fit's <see cref="MaximumError"/>, finite and non-negative.</param>
    /// <param name="rmsError">The fit's <see cref="RmsError"/>, finite and non-negative.</param>
    /// <param name="explainedFraction">The fit's <see cref="ExplainedFraction"/>, in [0, 1].</param>
    /// <returns>A basis whose projections and reconstructions are bit-identical to the original's.</returns>
    /// <exception cref="ArgumentNullException">An array is null.</exception>
    /// <exception cref="ArgumentException">Sizes disagree or a value is out of range; the message names it.</exception>
    public static PrincipalComponents FromArrays(
        double[] mean, double[] scale, double[] basis, double[] singularValues, double maximumError, double rmsError, double explainedFraction)
    {
        ArgumentNullException.ThrowIfNull(mean);
        ArgumentNullException.ThrowIfNull(scale);
        ArgumentNullException.ThrowIfNull(basis);
        ArgumentNullException.ThrowIfNull(singularValues);
        if (mean.Length == 0)
        {
            throw new ArgumentException("At least one feature is needed.", nameof(mean));
        }

        Arguments.RequireFinite(mean, nameof(mean));
        Arguments.RequireLength(scale.Length, mean.Length, nameof(scale));
        Arguments.RequirePositive(scale, nameof(scale));
        if (singularValues.Length == 0)
        {
            throw new ArgumentException("At least one component is needed.", nameof(singularValues));
        }

        Arguments.RequireLength(basis.Length, singularValues.Length * mean.Length, nameof(basis));
        Arguments.RequireFinite(basis, nameof(basis));
        Arguments.RequireFinite(singularValues, nameof(singularValues));
        RequireNonNegative(maximumError, nameof(maximumError));
        RequireNonNegative(rmsError, nameof(rmsError));
        if (!(explainedFraction >= 0.0 && explainedFraction <= 1.0))
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"explainedFraction = {explainedFraction:R} must lie in [0, 1]."), nameof(explainedFraction));
        }

        return new PrincipalComponents(
            (double[])mean.Clone(), (double[])scale.Clone(), (double[])basis.Clone(), (double[])singularValues.Clone(),
            maximumError, rmsError, explainedFraction);
    }

    /// <summary>Coefficients a_c = v_c · ((x − m) / s) of one feature vector.</summary>
    /// <param name="features">x, length <see cref="FeatureCount"/>, in feature units.</param>
    /// <param name="coefficients">Receives a, length <see cref="Count"/>.</param>
    /// <exception cref="ArgumentException">A length is wrong.</exception>
    public void Project(ReadOnlySpan<double> features, Span<double> coefficients)
    {
        Arguments.RequireLength(features.Length, FeatureCount, nameof(features));
        Arguments.RequireLength(coefficients.Length, Count, nameof(coefficients));
        int p = FeatureCount;
        for (int c = 0; c < Count; c++)
        {
            ReadOnlySpan<double> component = _basis.AsSpan(c * p, p);
            double sum = 0.0;
            for (int f = 0; f < p; f++)
            {
                sum += component[f] * ((features[f] - _mean[f]) / _scale[f]);
            }

            coefficients[c] = sum;
        }
    }

    /// <summary>Coefficients of every row of <paramref name="data"/> (samples × features), as samples × components.</summary>
    /// <param name="data">One feature vector per row, <see cref="FeatureCount"/> columns.</param>
    /// <returns>A new matrix of coefficients.</returns>
    /// <exception cref="ArgumentException">The column count is wrong.</exception>
    public Matrix<double> Project(Matrix<double> data)
    {
        ArgumentNullException.ThrowIfNull(data);
        Arguments.RequireLength(data.ColumnCount, FeatureCount, nameof(data));
        var result = Matrix<double>.Build.Dense(data.RowCount, Count);
        var row = new double[FeatureCount];
        var coefficients = new double[Count];
        for (int i = 0; i < data.RowCount; i++)
        {
            for (int f = 0; f < row.Length; f++)
            {
                row[f] = data[i, f];
            }

            Project(row, coefficients);
            for (int c = 0; c < coefficients.Length; c++)
            {
                result[i, c] = coefficients[c];
            }
        }

        return result;
    }

    /// <summary>x̂ = m + s ⊙ Σ_c a_c v_c, without allocating.</summary>
    /// <param name="coefficients">a, length <see cref="Count"/>.</param>
    /// <param name="features">Receives x̂, length <see cref="FeatureCount"/>, in feature units.</param>
    /// <exception cref="ArgumentException">A length is wrong.</exception>
    public void Reconstruct(ReadOnlySpan<double> coefficients, Span<double> features)
    {
        Arguments.RequireLength(coefficients.Length, Count, nameof(coefficients));
        Arguments.RequireLength(features.Length, FeatureCount, nameof(features));
        int p = FeatureCount;
        features.Clear();
        for (int c = 0; c < coefficients.Length; c++)
        {
            SpanArithmetic.AddScaled(coefficients[c], _basis.AsSpan(c * p, p), features);
        }

        for (int f = 0; f < p; f++)
        {
            features[f] = _mean[f] + (_scale[f] * features[f]);
        }
    }

    private static void RequireNonNegative(double value, string name)
    {
        if (!(value >= 0.0) || !double.IsFinite(value))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"{name} = {value:R} must be finite and non-negative."), name);
        }
    }
}
