using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Emulation.Emulators;

/// <summary>
/// An explicit mean function for the Gaussian processes (Rasmussen &amp; Williams 2006, §2.7): a polynomial of degree
/// 0, 1 or 2 in the unit-box inputs, fitted to each output by least squares; the processes then learn only the
/// residual. Spectra depend nearly linearly on ln A_s and smoothly on the rest, so a quadratic takes most of the
/// variation out for the cost of a few dozen multiply-adds per prediction.
/// </summary>
public sealed class QuadraticTrend
{
    private readonly double[] _coefficients;

    /// <summary>Creates a trend from its coefficients (feature-major: [f·outputs + j]).</summary>
    /// <exception cref="ArgumentException">Sizes disagree or the degree is not 0, 1 or 2.</exception>
    public QuadraticTrend(int degree, int dimensions, int outputs, double[] coefficients)
    {
        ArgumentNullException.ThrowIfNull(coefficients);
        if (degree is < 0 or > 2 || dimensions < 1 || outputs < 1 || coefficients.Length != FeatureCount(degree, dimensions) * outputs
            || coefficients.Any(c => !double.IsFinite(c)))
        {
            throw new ArgumentException($"a degree-{degree} trend in {dimensions} inputs for {outputs} outputs needs {FeatureCount(degree, dimensions) * outputs} finite coefficients", nameof(coefficients));
        }

        Degree = degree;
        Dimensions = dimensions;
        Outputs = outputs;
        _coefficients = coefficients;
    }

    /// <summary>Polynomial degree.</summary>
    public int Degree { get; }

    /// <summary>Input dimensions.</summary>
    public int Dimensions { get; }

    /// <summary>Outputs.</summary>
    public int Outputs { get; }

    /// <summary>Coefficients, feature-major.</summary>
    public ReadOnlySpan<double> Coefficients => _coefficients;

    /// <summary>Number of monomials 1, u_q, u_q u_r (q ≤ r) up to <paramref name="degree"/>.</summary>
    public static int FeatureCount(int degree, int dimensions) =>
        1 + (degree >= 1 ? dimensions : 0) + (degree >= 2 ? dimensions * (dimensions + 1) / 2 : 0);

    /// <summary>Least-squares fit of every column of <paramref name="outputs"/> (n × m) on the monomials of <paramref name="inputs"/> (n × d).</summary>
    public static QuadraticTrend Fit(Matrix<double> inputs, Matrix<double> outputs, int degree)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(outputs);
        int n = inputs.RowCount, d = inputs.ColumnCount, m = outputs.ColumnCount, f = FeatureCount(degree, d);
        if (n < f)
        {
            throw new ArgumentException($"a degree-{degree} trend in {d} inputs needs at least {f} training points, got {n}", nameof(inputs));
        }

        var design = Matrix<double>.Build.Dense(n, f);
        var row = new double[f];
        var point = new double[d];
        for (int i = 0; i < n; i++)
        {
            for (int q = 0; q < d; q++)
            {
                point[q] = inputs[i, q];
            }

            Features(degree, point, row);
            design.SetRow(i, row);
        }

        var solution = design.QR().Solve(outputs);
        var coefficients = new double[f * m];
        for (int k = 0; k < f; k++)
        {
            for (int j = 0; j < m; j++)
            {
                coefficients[(k * m) + j] = solution[k, j];
            }
        }

        return new QuadraticTrend(degree, d, m, coefficients);
    }

    /// <summary>Adds the trend of every output to <paramref name="values"/> and, if non-empty, its input gradient to <paramref name="gradient"/> ([j·d + q]).</summary>
    public void Add(ReadOnlySpan<double> input, Span<double> values, Span<double> gradient)
    {
        int d = Dimensions, m = Outputs;
        for (int j = 0; j < m; j++)
        {
            values[j] += _coefficients[j];
        }

        if (Degree == 0)
        {
            return;
        }

        for (int q = 0; q < d; q++)
        {
            int offset = (1 + q) * m;
            for (int j = 0; j < m; j++)
            {
                double c = _coefficients[offset + j];
                values[j] += c * input[q];
                if (!gradient.IsEmpty)
                {
                    gradient[(j * d) + q] += c;
                }
            }
        }

        if (Degree == 1)
        {
            return;
        }

        int feature = 1 + d;
        for (int q = 0; q < d; q++)
        {
            for (int r = q; r < d; r++, feature++)
            {
                int offset = feature * m;
                double product = input[q] * input[r];
                for (int j = 0; j < m; j++)
                {
                    double c = _coefficients[offset + j];
                    values[j] += c * product;
                    if (!gradient.IsEmpty)
                    {
                        gradient[(j * d) + q] += c * input[r];
                        gradient[(j * d) + r] += c * input[q];
                    }
                }
            }
        }
    }

    private static void Features(int degree, ReadOnlySpan<double> u, Span<double> features)
    {
        int d = u.Length, f = 0;
        features[f++] = 1.0;
        if (degree >= 1)
        {
            for (int q = 0; q < d; q++)
            {
                features[f++] = u[q];
            }
        }

        if (degree >= 2)
        {
            for (int q = 0; q < d; q++)
            {
                for (int r = q; r < d; r++)
                {
                    features[f++] = u[q] * u[r];
                }
            }
        }
    }
}
