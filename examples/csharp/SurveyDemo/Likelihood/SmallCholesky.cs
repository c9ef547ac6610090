namespace Sibyl.Demo.Likelihood;

/// <summary>Cholesky factorisation and solves for the few-by-few matrices of the analytic marginalisation (Golub &amp; Van Loan, §4.2).</summary>
public static class SmallCholesky
{
    /// <summary>Overwrites the lower triangle of the symmetric positive-definite n×n row-major <paramref name="a"/> with L (A = LLᵀ).</summary>
    /// <returns>ln det A = 2 Σ ln L_ii.</returns>
    /// <exception cref="ArithmeticException">A is not positive definite.</exception>
    public static double Factor(double[] a, int n)
    {
        ArgumentNullException.ThrowIfNull(a);
        double logDet = 0.0;
        for (int j = 0; j < n; j++)
        {
            double diagonal = a[(j * n) + j];
            for (int k = 0; k < j; k++)
            {
                diagonal -= a[(j * n) + k] * a[(j * n) + k];
            }

            if (!(diagonal > 0.0))
            {
                throw new ArithmeticException("the marginalisation matrix is not positive definite");
            }

            double root = Math.Sqrt(diagonal);
            a[(j * n) + j] = root;
            logDet += 2.0 * Math.Log(root);
            for (int i = j + 1; i < n; i++)
            {
                double sum = a[(i * n) + j];
                for (int k = 0; k < j; k++)
                {
                    sum -= a[(i * n) + k] * a[(j * n) + k];
                }

                a[(i * n) + j] = sum / root;
            }
        }

        return logDet;
    }

    /// <summary>Solves LLᵀx = b in place, with L from <see cref="Factor"/>.</summary>
    public static void Solve(double[] factor, int n, double[] b)
    {
        ArgumentNullException.ThrowIfNull(factor);
        ArgumentNullException.ThrowIfNull(b);
        for (int i = 0; i < n; i++)
        {
            double sum = b[i];
            for (int k = 0; k < i; k++)
            {
                sum -= factor[(i * n) + k] * b[k];
            }

            b[i] = sum / factor[(i * n) + i];
        }

        for (int i = n - 1; i >= 0; i--)
        {
            double sum = b[i];
            for (int k = i + 1; k < n; k++)
            {
                sum -= factor[(k * n) + i] * b[k];
            }

            b[i] = sum / factor[(i * n) + i];
        }
    }
}
