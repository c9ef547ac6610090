using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;

namespace Sibyl.Emulation.Compression;

/// <content>Fitting: standardize, decompose, keep the fewest components that meet the tolerance.</content>
public sealed partial class PrincipalComponents
{
    /// <summary>Fits a basis to <paramref name="data"/>, stored row-major as samples × features.</summary>
    /// <param name="data">sampleCount × featureCount values, row-major, all finite.</param>
    /// <param name="sampleCount">Number of samples (rows), at least 2.</param>
    /// <param name="options">Tolerance, maximum count and scale.</param>
    /// <returns>The fitted basis.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">See <see cref="Fit(Matrix{double}, PrincipalComponentsOptions)"/>.</exception>
    public static PrincipalComponents Fit(double[] data, int sampleCount, PrincipalComponentsOptions options)
    {
        ArgumentNullException.ThrowIfNull(data);
        if (sampleCount < 2 || data.Length % sampleCount != 0 || data.Length == 0)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"{data.Length} values do not form {sampleCount} ≥ 2 rows of equal length."),
                nameof(sampleCount));
        }

        int features = data.Length / sampleCount;
        return Fit(Matrix<double>.Build.Dense(sampleCount, features, (i, f) => data[(i * features) + f]), options);
    }

    /// <summary>
    /// Fits a basis to <paramref name="data"/> (one sample per row): subtracts the per-feature mean, divides by the
    /// per-feature scale, takes the singular value decomposition and keeps the smallest number of leading components
    /// for which the largest reconstruction error over the training data is at most
    /// <see cref="PrincipalComponentsOptions.Tolerance"/>, or <see cref="PrincipalComponentsOptions.MaximumCount"/>
    /// components, or the rank, whichever comes first.
    /// </summary>
    /// <remarks>
    /// The decomposition is MathNet's SVD of the small triangular factor of a thin QR decomposition of the
    /// standardized data (or of its transpose when there are fewer samples than features), which gives the same
    /// right singular vectors as an SVD of the data itself without forming the large orthogonal factor. Each
    /// component's sign is fixed so that its largest-magnitude entry is positive, which makes the basis reproducible.
    /// </remarks>
    /// <param name="data">Samples × features, at least 2 rows and 1 column, all finite.</param>
    /// <param name="options">Tolerance, maximum count and scale.</param>
    /// <returns>The fitted basis.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">
    /// Fewer than 2 samples, a non-finite value, a scale of the wrong length or not positive, a negative or
    /// non-finite tolerance, or a maximum count below 1; the message names the argument.
    /// </exception>
    public static PrincipalComponents Fit(Matrix<double> data, PrincipalComponentsOptions options)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(options);
        int n = data.RowCount, p = data.ColumnCount;
        if (n < 2 || p < 1)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"data is {n} × {p}; at least 2 samples and 1 feature are needed."), nameof(data));
        }

        Arguments.RequireFinite(data, nameof(data));
        if (!(options.Tolerance >= 0.0) || !double.IsFinite(options.Tolerance))
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"Tolerance = {options.Tolerance:R} must be finite and non-negative."), nameof(options));
        }

        if (options.MaximumCount < 1)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"MaximumCount = {options.MaximumCount} must be at least 1."), nameof(options));
        }

        double[] scale = options.Scale is null ? Enumerable.Repeat(1.0, p).ToArray() : [.. options.Scale];
        Arguments.RequireLength(scale.Length, p, nameof(options.Scale));
        Arguments.RequirePositive(scale, nameof(options.Scale));

        double[] mean = new double[p];
        for (int f = 0; f < p; f++)
        {
            mean[f] = data.Column(f).Sum() / n;
        }

        var standardized = Matrix<double>.Build.Dense(n, p, (i, f) => (data[i, f] - mean[f]) / scale[f]);
        (double[] singular, Matrix<double> components) = RightSingularVectors(standardized);

        int limit = Math.Min(options.MaximumCount, singular.Length);
        double[] residual = standardized.ToRowMajorArray();
        int count = 0;
        (double maxError, double rmsError) = Errors(residual);
        // At least one component is kept so that the basis is never empty.
        while (count < limit && (count == 0 || maxError > options.Tolerance))
        {
            RemoveComponent(residual, n, p, components.Column(count));
            count++;
            (maxError, rmsError) = Errors(residual);
        }

        double total = singular.Sum(s => s * s);
        double kept = singular.Take(count).Sum(s => s * s);
        double[] basis = new double[count * p];
        for (int c = 0; c < count; c++)
        {
            for (int f = 0; f < p; f++)
            {
                basis[(c * p) + f] = components[f, c];
            }
        }

        return new PrincipalComponents(
            mean, scale, basis, singular[..count], maxError, rmsError, total > 0.0 ? Math.Min(1.0, kept / total) : 1.0);
    }

    /// <summary>Singular values (decreasing) and right singular vectors (as columns, p × r) of the n × p matrix z.</summary>
    private static (double[] Singular, Matrix<double> Vectors) RightSingularVectors(Matrix<double> z)
    {
        Matrix<double> vectors;
        double[] singular;
        if (z.RowCount >= z.ColumnCount)
        {
            // z = Q R and R = U S Vᵀ give z = (Q U) S Vᵀ.
            var r = z.QR(QRMethod.Thin).R;
            var svd = r.Svd(computeVectors: true);
            vectors = svd.VT.Transpose();
            singular = svd.S.ToArray();
        }
        else
        {
            // zᵀ = Q R and Rᵀ = U S Wᵀ give z = U S (Q W)ᵀ.
            var qr = z.Transpose().QR(QRMethod.Thin);
            var svd = qr.R.Transpose().Svd(computeVectors: true);
            vectors = qr.Q * svd.VT.Transpose();
            singular = svd.S.ToArray();
        }

        for (int c = 0; c < vectors.ColumnCount; c++)
        {
            int largest = vectors.Column(c).AbsoluteMaximumIndex();
            if (vectors[largest, c] < 0.0)
            {
                vectors.SetColumn(c, vectors.Column(c).Negate());
            }
        }

        return (singular, vectors);
    }

    /// <summary>residual ← residual − (residual v) vᵀ; v is orthogonal to the components already removed, so this is the truncation.</summary>
    private static void RemoveComponent(double[] residual, int n, int p, Vector<double> component)
    {
        double[] v = component.ToArray();
        for (int i = 0; i < n; i++)
        {
            Span<double> row = residual.AsSpan(i * p, p);
            SpanArithmetic.AddScaled(-SpanArithmetic.Dot(row, v), v, row);
        }
    }

    private static (double Max, double Rms) Errors(double[] residual)
    {
        double max = 0.0, squares = 0.0;
        foreach (double value in residual)
        {
            max = Math.Max(max, Math.Abs(value));
            squares += value * value;
        }

        return (max, Math.Sqrt(squares / residual.Length));
    }
}
