using System.Globalization;

namespace Sibyl.Demo.Theory;

/// <summary>The box checks every theory shares: right length, finite, inside [min, max].</summary>
public static class TheoryBox
{
    /// <summary>True when <paramref name="point"/> has the theory's length and lies inside its box.</summary>
    public static bool Contains(ISpectrumTheory theory, ReadOnlySpan<double> point)
    {
        ArgumentNullException.ThrowIfNull(theory);
        if (point.Length != theory.ParameterNames.Count)
        {
            return false;
        }

        for (int q = 0; q < point.Length; q++)
        {
            if (!(point[q] >= theory.Min[q] && point[q] <= theory.Max[q]))
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>Throws unless <paramref name="point"/> is inside the box.</summary>
    /// <exception cref="ArgumentException">Wrong length or outside the box; the message names the parameter and its range.</exception>
    public static void Check(ISpectrumTheory theory, ReadOnlySpan<double> point)
    {
        ArgumentNullException.ThrowIfNull(theory);
        if (point.Length != theory.ParameterNames.Count)
        {
            throw new ArgumentException($"expected {theory.ParameterNames.Count} values ({string.Join(", ", theory.ParameterNames)}), got {point.Length}");
        }

        for (int q = 0; q < point.Length; q++)
        {
            if (!(point[q] >= theory.Min[q] && point[q] <= theory.Max[q]))
            {
                throw new ArgumentException(string.Create(
                    CultureInfo.InvariantCulture,
                    $"{theory.ParameterNames[q]} = {point[q]:G} is outside the box [{theory.Min[q]:G}, {theory.Max[q]:G}]"));
            }
        }
    }
}
