using System.Numerics;

namespace Sibyl.Perturbation.Loops;

/// <summary>An exact rational number, used once at start-up so that series coefficients that vanish analytically are exactly zero.</summary>
internal readonly struct ExactFraction
{
    private ExactFraction(BigInteger numerator, BigInteger denominator)
    {
        if (denominator.Sign < 0)
        {
            numerator = -numerator;
            denominator = -denominator;
        }

        BigInteger divisor = BigInteger.GreatestCommonDivisor(numerator, denominator);
        if (!divisor.IsZero && !divisor.IsOne)
        {
            numerator /= divisor;
            denominator /= divisor;
        }

        Numerator = numerator;
        Denominator = denominator;
    }

    public BigInteger Numerator { get; }

    public BigInteger Denominator { get; }

    public static ExactFraction Zero => new(BigInteger.Zero, BigInteger.One);

    public static ExactFraction Of(long numerator, long denominator) => new(numerator, denominator);

    public static ExactFraction operator +(ExactFraction a, ExactFraction b) =>
        new((a.Numerator * b.Denominator) + (b.Numerator * a.Denominator), a.Denominator * b.Denominator);

    public static ExactFraction operator *(ExactFraction a, ExactFraction b) =>
        new(a.Numerator * b.Numerator, a.Denominator * b.Denominator);

    /// <summary>Nearest double (both parts stay far below the double range for the series used here).</summary>
    public double ToDouble() => (double)Numerator / (double)Denominator;
}
