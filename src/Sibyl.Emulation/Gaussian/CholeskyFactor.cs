namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Cholesky factorisation K = L Lᵀ of a symmetric positive-definite matrix, solves and the inverse, on row-major
/// arrays. Every inner loop is a dot product or an axpy over contiguous memory, so it runs on SIMD registers; written
/// here for that and to work in place on the fitter's arrays (no speed-up over MathNet's managed provider has been
/// measured) (Golub &amp; Van Loan 2013, "Matrix Computations", 4th ed., §4.2 and §3.1).
/// </summary>
internal static class CholeskyFactor
{
    /// <summary>Overwrites the lower triangle of <paramref name="matrix"/> (n × n row-major) with L and zeroes the rest; false if K is not numerically positive definite.</summary>
    public static bool TryFactor(double[] matrix, int n)
    {
        for (int i = 0; i < n; i++)
        {
            Span<double> rowI = matrix.AsSpan(i * n, n);
            for (int j = 0; j < i; j++)
            {
                ReadOnlySpan<double> rowJ = matrix.AsSpan(j * n, j + 1);
                rowI[j] = (rowI[j] - SpanArithmetic.Dot(rowI[..j], rowJ[..j])) / rowJ[j];
            }

            double pivot = rowI[i] - SpanArithmetic.Dot(rowI[..i], rowI[..i]);
            if (!(pivot > 0.0) || !double.IsFinite(pivot))
            {
                return false;
            }

            rowI[i] = Math.Sqrt(pivot);
            rowI[(i + 1)..].Clear();
        }

        return true;
    }

    /// <summary>ln det K = 2 Σ ln L_ii.</summary>
    public static double LogDeterminant(double[] factor, int n)
    {
        double sum = 0.0;
        for (int i = 0; i < n; i++)
        {
            sum += Math.Log(factor[(i * n) + i]);
        }

        return 2.0 * sum;
    }

    /// <summary>Overwrites b with K⁻¹b: forward substitution with L, then back substitution with Lᵀ.</summary>
    public static void Solve(double[] factor, int n, Span<double> b)
    {
        for (int i = 0; i < n; i++)
        {
            b[i] = (b[i] - SpanArithmetic.Dot(factor.AsSpan(i * n, i), b[..i])) / factor[(i * n) + i];
        }

        // Lᵀx = z by columns of Lᵀ (rows of L), so the inner loop is again contiguous.
        for (int i = n - 1; i >= 0; i--)
        {
            b[i] /= factor[(i * n) + i];
            SpanArithmetic.AddScaled(-b[i], factor.AsSpan(i * n, i), b[..i]);
        }
    }

    /// <summary>K⁻¹ (n × n row-major, both triangles) = L⁻ᵀL⁻¹.</summary>
    public static double[] Inverse(double[] factor, int n)
    {
        // X = L⁻¹ row by row: row_i(X) = (e_i − Σ_{k<i} L_ik row_k(X)) / L_ii.
        var x = new double[n * n];
        for (int i = 0; i < n; i++)
        {
            Span<double> rowI = x.AsSpan(i * n, i + 1);
            rowI[i] = 1.0;
            for (int k = 0; k < i; k++)
            {
                double c = factor[(i * n) + k];
                if (c != 0.0)
                {
                    SpanArithmetic.AddScaled(-c, x.AsSpan(k * n, k + 1), rowI);
                }
            }

            double inverseDiagonal = 1.0 / factor[(i * n) + i];
            for (int c = 0; c <= i; c++)
            {
                rowI[c] *= inverseDiagonal;
            }
        }

        // (K⁻¹)_ab = Σ_{k ≥ max(a, b)} X_ka X_kb: dot products of contiguous rows of Xᵀ.
        var t = new double[n * n];
        for (int k = 0; k < n; k++)
        {
            for (int a = 0; a <= k; a++)
            {
                t[(a * n) + k] = x[(k * n) + a];
            }
        }

        var inverse = x;
        for (int a = 0; a < n; a++)
        {
            ReadOnlySpan<double> tail = t.AsSpan((a * n) + a, n - a);
            for (int b = 0; b <= a; b++)
            {
                double value = SpanArithmetic.Dot(tail, t.AsSpan((b * n) + a, n - a));
                inverse[(a * n) + b] = value;
                inverse[(b * n) + a] = value;
            }
        }

        return inverse;
    }
}
