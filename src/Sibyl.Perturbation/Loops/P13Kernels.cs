namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The P_13 angular kernels K_s(r) = ∫_{−1}^{1} M_s(x, r) dx of the six <see cref="P13Structure"/>s,
/// to about 1e-14 relative for every r &gt; 0.
/// </summary>
/// <remarks>
/// Each structure is written as M_s = N_s(x, r)/p² with p² = 1 + r² − 2rx and N_s a polynomial of
/// degree ≤ 4 in x whose coefficients are Laurent polynomials in r (the aA·As term of AlphaAlpha is put
/// over the common denominator, which removes its cancellation against aB·As at large r).
/// Three regimes:
/// <list type="bullet">
/// <item>r ≤ 1/2: 1/p² = Σ U_n(x) rⁿ (Chebyshev polynomials of the second kind), so K_s is a Laurent series
/// in r with coefficients Σ c·∫xᵐU_n dx, computed in exact rational arithmetic so that the r⁻² and r⁻¹ parts
/// that cancel analytically are exactly absent.</item>
/// <item>r ≥ 2: 1/p² = r⁻² Σ U_n(x) r⁻ⁿ, a series in 1/r built the same way.</item>
/// <item>1/2 &lt; r &lt; 2: with x0 = (1 + r²)/(2r) ≥ 1 and N(x) = N(x0) + (x − x0)Q(x),
/// ∫N/p² dx = (N(x0)/r)·ln|(1 + r)/(1 − r)| − (1/(2r))∫Q dx, exact; the logarithm carries the r = 1
/// singularity (all six N_s vanish at x = r = 1, so K_s stays finite there with a (r − 1)ln|r − 1| kink).</item>
/// </list>
/// The series are truncated after <see cref="SeriesTerms"/> terms: at the switch points r = 1/2 and 2 the
/// first omitted term is below 2^-60 ≈ 1e-18 of the leading one.
/// </remarks>
internal static class P13Kernels
{
    /// <summary>Number of structures.</summary>
    public const int Count = MomentumIntegrals.P13StructureCount;

    private const int SeriesTerms = 64;
    private const int MaxDegree = 4;
    private const int MinPower = -2;
    private const int MaxPower = 2;
    private const double SmallSwitch = 0.5;
    private const double LargeSwitch = 2.0;

    // 4·c_{s,m,j}: coefficient of xᵐ rʲ in N_s, j = MinPower..MaxPower (derived from the definitions in P13Structure).
    private static readonly int[,,] QuarterCoefficients = BuildCoefficients();

    // Numeric Laurent coefficients of N_s in r, per structure and x power, for the closed-form regime.
    private static readonly double[,,] Coefficients = ToDoubles(QuarterCoefficients);

    // Small-r series: K_s(r) = Σ_t Small[s, t] r^(t + MinPower).
    private static readonly double[,] Small = BuildSmallSeries();

    // Large-r series: K_s(r) = Σ_t Large[s, t] r^(−t).
    private static readonly double[,] Large = BuildLargeSeries();

    /// <summary>Writes K_s(r) for all six structures, indexed by <see cref="P13Structure"/>.</summary>
    /// <param name="r">q/k, finite and positive.</param>
    /// <param name="kernels">Destination of length ≥ 6.</param>
    public static void Evaluate(double r, Span<double> kernels)
    {
        if (r <= SmallSwitch)
        {
            SumSeries(Small, r, kernels);
            double inverseSquare = 1.0 / (r * r);
            for (int s = 0; s < Count; s++)
            {
                kernels[s] *= inverseSquare;
            }
        }
        else if (r >= LargeSwitch)
        {
            SumSeries(Large, 1.0 / r, kernels);
        }
        else
        {
            EvaluateClosedForm(r, kernels);
        }
    }

    /// <summary>The closed form, valid for every r but only well conditioned near r = 1; exposed for tests of the switch points.</summary>
    internal static void EvaluateClosedForm(double r, Span<double> kernels)
    {
        double x0 = (1.0 + (r * r)) / (2.0 * r);
        double logarithm = r == 1.0 ? 0.0 : Math.Log(Math.Abs((1.0 + r) / (1.0 - r)));
        Span<double> polynomial = stackalloc double[MaxDegree + 1];
        for (int s = 0; s < Count; s++)
        {
            for (int m = 0; m <= MaxDegree; m++)
            {
                // Horner over r^(j − MinPower), j from MaxPower down, then the shift back by r^MinPower = r⁻².
                double sum = 0.0;
                for (int j = MaxPower; j >= MinPower; j--)
                {
                    sum = (sum * r) + Coefficients[s, m, j - MinPower];
                }

                polynomial[m] = sum / (r * r);
            }

            // Synthetic division by (x − x0): quotient b_i, remainder N(x0).
            double quotient = polynomial[MaxDegree];
            double quotientIntegral = 0.0;
            for (int i = MaxDegree - 1; i >= 0; i--)
            {
                // `quotient` is b_i here; ∫x^i dx over [−1, 1] is 2/(i + 1) for even i.
                if (i % 2 == 0)
                {
                    quotientIntegral += quotient * 2.0 / (i + 1);
                }

                quotient = polynomial[i] + (x0 * quotient);
            }

            double valueAtPole = quotient;
            // At r = 1 exactly, N(x0 = 1) vanishes analytically and the logarithm is infinite: their product is zero.
            double logTerm = r == 1.0 ? 0.0 : valueAtPole * logarithm / r;
            kernels[s] = logTerm - (quotientIntegral / (2.0 * r));
        }
    }

    private static void SumSeries(double[,] series, double variable, Span<double> kernels)
    {
        for (int s = 0; s < Count; s++)
        {
            double sum = 0.0;
            for (int t = SeriesTerms - 1; t >= 0; t--)
            {
                sum = (sum * variable) + series[s, t];
            }

            kernels[s] = sum;
        }
    }

    private static double[,] BuildSmallSeries()
    {
        // Coefficient of r^t: Σ_{m,j} c_{m,j} μ_{m, t−j}.
        var series = new double[Count, SeriesTerms];
        for (int s = 0; s < Count; s++)
        {
            for (int index = 0; index < SeriesTerms; index++)
            {
                int t = index + MinPower;
                ExactFraction sum = ExactFraction.Zero;
                for (int m = 0; m <= MaxDegree; m++)
                {
                    for (int j = MinPower; j <= MaxPower; j++)
                    {
                        int n = t - j;
                        int c = QuarterCoefficients[s, m, j - MinPower];
                        if (n >= 0 && c != 0)
                        {
                            sum += ExactFraction.Of(c, 4) * ChebyshevMoment(m, n);
                        }
                    }
                }

                series[s, index] = sum.ToDouble();
            }
        }

        return series;
    }

    private static double[,] BuildLargeSeries()
    {
        // 1/p² = Σ_n U_n r^(−n−2): coefficient of r^(−t) is Σ_{m,j} c_{m,j} μ_{m, t+j−2}.
        var series = new double[Count, SeriesTerms];
        for (int s = 0; s < Count; s++)
        {
            for (int t = 0; t < SeriesTerms; t++)
            {
                ExactFraction sum = ExactFraction.Zero;
                for (int m = 0; m <= MaxDegree; m++)
                {
                    for (int j = MinPower; j <= MaxPower; j++)
                    {
                        int n = t + j - 2;
                        int c = QuarterCoefficients[s, m, j - MinPower];
                        if (n >= 0 && c != 0)
                        {
                            sum += ExactFraction.Of(c, 4) * ChebyshevMoment(m, n);
                        }
                    }
                }

                series[s, t] = sum.ToDouble();
            }
        }

        return series;
    }

    /// <summary>
    /// μ_{m,n} = ∫_{−1}^{1} xᵐ U_n(x) dx. With x = cos θ it is ∫_0^π cosᵐθ sin((n+1)θ) dθ; expanding
    /// cosᵐθ = 2⁻ᵐ Σ_i C(m,i) cos((m − 2i)θ) and using ∫_0^π sin(bθ) dθ = 2/b for odd b (0 for even b)
    /// gives μ_{m,n} = 2⁻ᵐ Σ_i C(m,i)·2/(n + 1 + m − 2i) over odd arguments.
    /// </summary>
    private static ExactFraction ChebyshevMoment(int m, int n)
    {
        ExactFraction sum = ExactFraction.Zero;
        long binomial = 1;
        for (int i = 0; i <= m; i++)
        {
            int b = n + 1 + m - (2 * i);
            if (b % 2 != 0)
            {
                sum += ExactFraction.Of(2 * binomial, b);
            }

            binomial = binomial * (m - i) / (i + 1);
        }

        return sum * ExactFraction.Of(1, 1L << m);
    }

    private static int[,,] BuildCoefficients()
    {
        var c = new int[Count, MaxDegree + 1, MaxPower - MinPower + 1];

        void Set(P13Structure s, int xPower, int rPower, int quarters) => c[(int)s, xPower, rPower - MinPower] = quarters;

        // AlphaAlpha: (x + r − 2rx²)(1 − (x/2)(r + 1/r))/r
        //   = 1 + x(1 − r²)/(2r) − x²(5/2 + 1/(2r²)) + x³(r + 1/r).
        Set(P13Structure.AlphaAlpha, 0, 0, 4);
        Set(P13Structure.AlphaAlpha, 1, -1, 2);
        Set(P13Structure.AlphaAlpha, 1, 1, -2);
        Set(P13Structure.AlphaAlpha, 2, 0, -10);
        Set(P13Structure.AlphaAlpha, 2, -2, -2);
        Set(P13Structure.AlphaAlpha, 3, 1, 4);
        Set(P13Structure.AlphaAlpha, 3, -1, 4);
        // AlphaGamma: (1 − rx)(1 − x²) = 1 − rx − x² + rx³.
        Set(P13Structure.AlphaGamma, 0, 0, 4);
        Set(P13Structure.AlphaGamma, 1, 1, -4);
        Set(P13Structure.AlphaGamma, 2, 0, -4);
        Set(P13Structure.AlphaGamma, 3, 1, 4);
        // BetaAlpha: (x − r)(1 − (x/2)(r + 1/r))/(2r) = −1/2 + x(r/4 + 3/(4r)) − x²(1/4 + 1/(4r²)).
        Set(P13Structure.BetaAlpha, 0, 0, -2);
        Set(P13Structure.BetaAlpha, 1, 1, 1);
        Set(P13Structure.BetaAlpha, 1, -1, 3);
        Set(P13Structure.BetaAlpha, 2, 0, -1);
        Set(P13Structure.BetaAlpha, 2, -2, -1);
        // BetaGamma: (x − r)(1 − x²)/(2r) = −1/2 + x/(2r) + x²/2 − x³/(2r).
        Set(P13Structure.BetaGamma, 0, 0, -2);
        Set(P13Structure.BetaGamma, 1, -1, 2);
        Set(P13Structure.BetaGamma, 2, 0, 2);
        Set(P13Structure.BetaGamma, 3, -1, -2);
        // GammaAlpha: (1 − x²)(1 − (x/2)(r + 1/r)) = 1 − x(r + 1/r)/2 − x² + x³(r + 1/r)/2.
        Set(P13Structure.GammaAlpha, 0, 0, 4);
        Set(P13Structure.GammaAlpha, 1, 1, -2);
        Set(P13Structure.GammaAlpha, 1, -1, -2);
        Set(P13Structure.GammaAlpha, 2, 0, -4);
        Set(P13Structure.GammaAlpha, 3, 1, 2);
        Set(P13Structure.GammaAlpha, 3, -1, 2);
        // GammaGamma: (1 − x²)² = 1 − 2x² + x⁴.
        Set(P13Structure.GammaGamma, 0, 0, 4);
        Set(P13Structure.GammaGamma, 2, 0, -8);
        Set(P13Structure.GammaGamma, 4, 0, 4);
        return c;
    }

    private static double[,,] ToDoubles(int[,,] quarters)
    {
        var result = new double[quarters.GetLength(0), quarters.GetLength(1), quarters.GetLength(2)];
        for (int s = 0; s < quarters.GetLength(0); s++)
        {
            for (int m = 0; m < quarters.GetLength(1); m++)
            {
                for (int j = 0; j < quarters.GetLength(2); j++)
                {
                    result[s, m, j] = quarters[s, m, j] / 4.0;
                }
            }
        }

        return result;
    }
}
