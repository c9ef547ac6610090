using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>
/// The φ-averaged coefficients c_{ab,n} of the engine against the literal vector-level structures
/// (project lead's definitions of Z2's seven structures), at random configurations.
/// </summary>
public sealed class RedshiftP22CoefficientTests
{
    // 64 equally spaced φ: the trapezoid rule is exact for the products, trigonometric polynomials of degree ≤ 4 in φ.
    private const int AzimuthCount = 64;

    // Rounding only: both sides are exact formulas in double precision; the vector side loses up to ~q/k digits
    // where α_s and γ cancel at q ≫ k, hence q/k ≤ 10 and a scale of ⟨|S_a S_b|⟩ + 1e-3⟨|S_a|⟩⟨|S_b|⟩.
    private const double Tolerance = 1e-12;

    private static readonly RedshiftP22Structure[] Structures = Enum.GetValues<RedshiftP22Structure>();

    [Fact]
    public void Azimuthal_averages_of_all_structure_products_are_the_stated_polynomials_in_mu_squared()
    {
        var random = new Random(20261202);
        Span<double> bases = stackalloc double[RedshiftP22BaseFunctions.FunctionCount];
        var average = new double[VectorStructures.Count * VectorStructures.Count];
        var absolute = new double[VectorStructures.Count * VectorStructures.Count];
        var single = new double[VectorStructures.Count];
        double worst = 0.0;
        for (int trial = 0; trial < 200; trial++)
        {
            double k = 0.01 + (0.5 * random.NextDouble());
            double q = k * Math.Exp(Math.Log(10.0) * ((2.0 * random.NextDouble()) - 1.0));
            double x = (2.0 * random.NextDouble()) - 1.0;
            double mu = (2.0 * random.NextDouble()) - 1.0;
            double p = Math.Sqrt(((k - q) * (k - q)) + (2.0 * k * q * (1.0 - x)));
            RedshiftP22BaseFunctions.Instance.Evaluate(k, q, p, bases);
            DirectAverages(k, mu, q, x, average, absolute, single);
            foreach (var a in Structures)
            {
                foreach (var b in Structures)
                {
                    double polynomial = 0.0;
                    for (int n = 4; n >= 0; n--)
                    {
                        polynomial = (polynomial * mu * mu) + RedshiftP22Layout.Coefficient(bases, a, b, n);
                    }

                    int index = ((int)a * VectorStructures.Count) + (int)b;
                    double scale = absolute[index];
                    double error = Math.Abs(polynomial - average[index]) / scale;
                    worst = Math.Max(worst, error);
                    Assert.True(
                        error <= Tolerance,
                        $"({a}, {b}) at k = {k:R}, q = {q:R}, x = {x:R}, μ = {mu:R}: {polynomial:R} vs direct {average[index]:R}.");
                }
            }
        }

        Assert.True(worst <= Tolerance, $"worst {worst:R}");
    }

    [Fact]
    public void Azimuthal_averages_are_symmetric_under_exchange_of_q_and_k_minus_q()
    {
        // The half-domain p ≥ q of the table relies on ⟨S_a S_b⟩_φ(k, q, p) = ⟨S_a S_b⟩_φ(k, p, q). Checked on the
        // literal vector products (with p as the integration vector, x' = k̂·p̂) and on the engine's base functions.
        var random = new Random(7);
        var average = new double[VectorStructures.Count * VectorStructures.Count];
        var swapped = new double[VectorStructures.Count * VectorStructures.Count];
        var absolute = new double[VectorStructures.Count * VectorStructures.Count];
        var single = new double[VectorStructures.Count];
        Span<double> bases = stackalloc double[RedshiftP22BaseFunctions.FunctionCount];
        Span<double> basesSwapped = stackalloc double[RedshiftP22BaseFunctions.FunctionCount];
        for (int trial = 0; trial < 100; trial++)
        {
            double k = 0.01 + (0.5 * random.NextDouble());
            double q = k * Math.Exp(Math.Log(10.0) * ((2.0 * random.NextDouble()) - 1.0));
            double x = (2.0 * random.NextDouble()) - 1.0;
            double mu = (2.0 * random.NextDouble()) - 1.0;
            double p = Math.Sqrt(((k - q) * (k - q)) + (2.0 * k * q * (1.0 - x)));
            double xSwapped = (k - (q * x)) / p;
            DirectAverages(k, mu, p, xSwapped, swapped, absolute, single);
            DirectAverages(k, mu, q, x, average, absolute, single);
            for (int i = 0; i < average.Length; i++)
            {
                double scale = absolute[i];
                Assert.True(Math.Abs(average[i] - swapped[i]) <= Tolerance * scale, $"pair {i} at k = {k:R}, q = {q:R}, x = {x:R}");
            }

            RedshiftP22BaseFunctions.Instance.Evaluate(k, q, p, bases);
            RedshiftP22BaseFunctions.Instance.Evaluate(k, p, q, basesSwapped);
            for (int s = 0; s < bases.Length; s++)
            {
                Assert.True(Math.Abs(bases[s] - basesSwapped[s]) <= 1e-14 * Math.Abs(bases[s]), $"base {s} at k = {k:R}, q = {q:R}, p = {p:R}");
            }
        }
    }

    [Fact]
    public void Order_of_the_pair_is_irrelevant_and_powers_outside_0_to_4_are_rejected()
    {
        foreach (var a in Structures)
        {
            foreach (var b in Structures)
            {
                for (int n = 0; n < RedshiftP22Layout.PowerCount; n++)
                {
                    Assert.Equal(RedshiftP22Layout.RowIndex(a, b, n), RedshiftP22Layout.RowIndex(b, a, n));
                }
            }
        }

        Assert.Throws<ArgumentOutOfRangeException>(() => RedshiftP22Layout.RowIndex(RedshiftP22Structure.L1, RedshiftP22Structure.L2, 5));
        Assert.Throws<ArgumentOutOfRangeException>(() => RedshiftP22Layout.RowIndex(RedshiftP22Structure.L1, RedshiftP22Structure.L2, -1));
        Assert.Throws<ArgumentOutOfRangeException>(() => RedshiftP22Layout.RowIndex((RedshiftP22Structure)7, RedshiftP22Structure.L2, 0));
    }

    /// <summary>⟨S_a S_b⟩_φ, ⟨|S_a S_b|⟩_φ and ⟨|S_a|⟩_φ from the literal vectors at 64 equally spaced φ.</summary>
    private static void DirectAverages(double k, double mu, double q, double x, double[] average, double[] absolute, double[] single)
    {
        Array.Clear(average);
        Array.Clear(absolute);
        Array.Clear(single);
        Span<double> values = stackalloc double[VectorStructures.Count];
        for (int m = 0; m < AzimuthCount; m++)
        {
            (var kv, var qv) = VectorStructures.Configuration(k, mu, q, x, 2.0 * Math.PI * m / AzimuthCount);
            VectorStructures.Evaluate(kv, qv, values);
            for (int a = 0; a < VectorStructures.Count; a++)
            {
                single[a] += Math.Abs(values[a]) / AzimuthCount;
                for (int b = 0; b < VectorStructures.Count; b++)
                {
                    double product = values[a] * values[b];
                    average[(a * VectorStructures.Count) + b] += product / AzimuthCount;
                    absolute[(a * VectorStructures.Count) + b] += Math.Abs(product) / AzimuthCount;
                }
            }
        }
    }
}
