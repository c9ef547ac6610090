using ScottPlot;

namespace Sibyl.Plotting;

/// <summary>
/// Tick marks for an axis that ScottPlot draws in log10 coordinates. Majors sit on decades when at least two
/// decades are in view, labelled with the value (0.01, 0.1, 1) rather than its logarithm, and minors mark 2..9 times
/// each decade. Narrower ranges fall back to 1-2-5 multiples, then to every digit, then to an even grid of values,
/// so an axis never ends up with fewer than two labels.
/// </summary>
internal static class LogTicks
{
    /// <summary>Decades outside this band are labelled 10ⁿ, because a decimal would be too long to read.</summary>
    private const int SmallestDecimalExponent = -4;
    private const int LargestDecimalExponent = 5;

    /// <summary>Tolerance, in decades, for a tick that sits on an edge of the range.</summary>
    private const double Edge = 1e-9;

    private static readonly int[] OneTwoFive = [1, 2, 5];
    private static readonly int[] EveryDigit = [1, 2, 3, 4, 5, 6, 7, 8, 9];

    /// <summary>Ticks for the log10 range [<paramref name="min"/>, <paramref name="max"/>].</summary>
    /// <param name="min">Lower limit, as a log10 value.</param>
    /// <param name="max">Upper limit, as a log10 value.</param>
    /// <param name="maxMajorTicks">How many labels fit along the axis.</param>
    public static Tick[] Generate(double min, double max, int maxMajorTicks)
    {
        int first = (int)Math.Ceiling(min - Edge);
        int last = (int)Math.Floor(max + Edge);
        if (last - first + 1 >= 2)
        {
            return Decades(min, max, first, last, maxMajorTicks);
        }

        foreach (int[] mantissas in new[] { OneTwoFive, EveryDigit })
        {
            List<(int Mantissa, int Exponent)> majors = Multiples(min, max, mantissas);
            if (majors.Count >= 2 && majors.Count <= Math.Max(2, maxMajorTicks))
            {
                return WithDigitMinors(min, max, majors);
            }
        }

        return EvenGrid(min, max, maxMajorTicks);
    }

    private static Tick[] Decades(double min, double max, int first, int last, int maxMajorTicks)
    {
        int stride = (int)Math.Ceiling((last - first + 1) / (double)Math.Max(2, maxMajorTicks));
        bool asDecimal = first >= SmallestDecimalExponent && last <= LargestDecimalExponent;
        var ticks = new List<Tick>();
        for (int e = first; e <= last; e++)
        {
            if (Modulo(e, stride) == 0)
            {
                ticks.Add(Tick.Major(e, TickLabels.Power(1, e, asDecimal)));
            }
            else
            {
                ticks.Add(Tick.Minor(e));
            }
        }

        // With decades skipped, 2..9 marks would crowd out the decades that carry the scale.
        if (stride == 1)
        {
            for (int e = first - 1; e <= last; e++)
            {
                for (int m = 2; m <= 9; m++)
                {
                    double position = e + Math.Log10(m);
                    if (position >= min - Edge && position <= max + Edge)
                    {
                        ticks.Add(Tick.Minor(position));
                    }
                }
            }
        }

        return [.. ticks];
    }

    private static List<(int Mantissa, int Exponent)> Multiples(double min, double max, int[] mantissas)
    {
        var found = new List<(int, int)>();
        for (int e = (int)Math.Floor(min) - 1; e <= (int)Math.Ceiling(max); e++)
        {
            foreach (int m in mantissas)
            {
                double position = e + Math.Log10(m);
                if (position >= min - Edge && position <= max + Edge)
                {
                    found.Add((m, e));
                }
            }
        }

        return found;
    }

    private static Tick[] WithDigitMinors(double min, double max, List<(int Mantissa, int Exponent)> majors)
    {
        bool asDecimal = majors.TrueForAll(t => t.Exponent >= SmallestDecimalExponent && t.Exponent <= LargestDecimalExponent);
        var ticks = majors.ConvertAll(t => Tick.Major(t.Exponent + Math.Log10(t.Mantissa), TickLabels.Power(t.Mantissa, t.Exponent, asDecimal)));
        foreach ((int m, int e) in Multiples(min, max, EveryDigit))
        {
            if (!majors.Contains((m, e)))
            {
                ticks.Add(Tick.Minor(e + Math.Log10(m)));
            }
        }

        return [.. ticks];
    }

    private static Tick[] EvenGrid(double min, double max, int maxMajorTicks)
    {
        double low = Math.Pow(10, min);
        double high = Math.Pow(10, max);
        double step = NiceStep((high - low) / Math.Clamp(maxMajorTicks - 1, 1, 5));
        var ticks = new List<Tick>();
        for (double k = Math.Ceiling(low / step); k * step <= high; k++)
        {
            double value = k * step;
            ticks.Add(Tick.Major(Math.Log10(value), TickLabels.Fixed(value, step)));
        }

        return [.. ticks];
    }

    /// <summary>The smallest of 1, 2 or 5 times a power of ten that is at least <paramref name="rough"/>.</summary>
    private static double NiceStep(double rough)
    {
        double power = Math.Pow(10, Math.Floor(Math.Log10(rough)));
        double fraction = rough / power;
        double nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
        return nice * power;
    }

    private static int Modulo(int value, int divisor) => ((value % divisor) + divisor) % divisor;
}
