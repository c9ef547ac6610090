namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// The standard Einstein–de Sitter P_13 bracket
/// B(r) = 12/r² − 158 + 100r² − 42r⁴ + (3/r³)(r² − 1)³(7r² + 2) ln|(1 + r)/(1 − r)|
/// (Bernardeau, Colombi, Gaztañaga &amp; Scoccimarro 2002, Phys. Rep. 367, 1; quoted from memory and
/// verified numerically against the structures of P13Structure), with P13 = k³P(k)/(1008π²)∫dr P(kr) B(r).
/// Away from r ≈ 1 the closed form cancels badly, so there it is summed as a series in r² or 1/r².
/// </summary>
internal static class ReducedP13Kernel
{
    // (r² − 1)³(7r² + 2) = Σ_a c_a r^(2a).
    private static readonly double[] Polynomial = [-2.0, -1.0, 15.0, -19.0, 7.0];

    private const int Terms = 40;

    public static double Evaluate(double r)
    {
        if (r < 0.2)
        {
            return SmallSeries(r);
        }

        if (r > 5.0)
        {
            return LargeSeries(r);
        }

        return ClosedForm(r);
    }

    public static double ClosedForm(double r)
    {
        double r2 = r * r;
        double log = r == 1.0 ? 0.0 : Math.Log(Math.Abs((1.0 + r) / (1.0 - r)));
        double cube = (r2 - 1.0) * (r2 - 1.0) * (r2 - 1.0);
        return (12.0 / r2) - 158.0 + (100.0 * r2) - (42.0 * r2 * r2) + (3.0 / (r2 * r) * cube * ((7.0 * r2) + 2.0) * log);
    }

    /// <summary>Coefficient of r^(2t) in the small-r expansion, t ≥ −1, using ln|(1+r)/(1−r)| = 2Σ r^(2i+1)/(2i+1).</summary>
    public static double SmallCoefficient(int t)
    {
        double sum = 0.0;
        for (int a = 0; a < Polynomial.Length; a++)
        {
            int i = t + 1 - a;
            if (i >= 0)
            {
                sum += 6.0 * Polynomial[a] / ((2 * i) + 1);
            }
        }

        return sum + t switch { -1 => 12.0, 0 => -158.0, 1 => 100.0, 2 => -42.0, _ => 0.0 };
    }

    /// <summary>Coefficient of r^(2t) in the large-r expansion, t ≤ 2, using ln((r+1)/(r−1)) = 2Σ r^−(2i+1)/(2i+1).</summary>
    public static double LargeCoefficient(int t)
    {
        double sum = 0.0;
        for (int a = 0; a < Polynomial.Length; a++)
        {
            int i = a - t - 2;
            if (i >= 0)
            {
                sum += 6.0 * Polynomial[a] / ((2 * i) + 1);
            }
        }

        return sum + t switch { -1 => 12.0, 0 => -158.0, 1 => 100.0, 2 => -42.0, _ => 0.0 };
    }

    private static double SmallSeries(double r)
    {
        double sum = 0.0;
        for (int t = Terms; t >= 0; t--)
        {
            sum = (sum * r * r) + SmallCoefficient(t);
        }

        return sum;
    }

    private static double LargeSeries(double r)
    {
        double inverse2 = 1.0 / (r * r);
        double sum = 0.0;
        for (int t = -Terms; t <= 0; t++)
        {
            sum = (sum * inverse2) + LargeCoefficient(t);
        }

        return sum;
    }
}
