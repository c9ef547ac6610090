using System.Globalization;
using System.Text;

namespace Sibyl.Plotting;

/// <summary>
/// Tick label text. Everything goes through the invariant culture: a decimal comma on an axis would be misread,
/// and ScottPlot's own formatter follows the current culture.
/// </summary>
internal static class TickLabels
{
    private const string Superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹";

    /// <summary>
    /// Label of <paramref name="mantissa"/> × 10^<paramref name="exponent"/>, built from the digits rather than a
    /// double so that 10^-3 reads 0.001 and never 0.0010000000000000002.
    /// </summary>
    public static string Power(int mantissa, int exponent, bool asDecimal)
    {
        string m = mantissa.ToString(CultureInfo.InvariantCulture);
        if (asDecimal)
        {
            return exponent >= 0 ? m + new string('0', exponent) : "0." + new string('0', -exponent - 1) + m;
        }

        var text = new StringBuilder();
        if (mantissa != 1)
        {
            text.Append(m).Append('×');
        }

        text.Append("10");
        if (exponent < 0)
        {
            text.Append('⁻');
        }

        foreach (char digit in Math.Abs(exponent).ToString(CultureInfo.InvariantCulture))
        {
            text.Append(Superscripts[digit - '0']);
        }

        return text.ToString();
    }

    /// <summary>
    /// Label of a tick on a grid of the given step, with as many decimals as the step itself has, so every label of an
    /// axis has the same number of decimals; values within rounding noise of zero read as zero, not -0.00.
    /// </summary>
    public static string Fixed(double value, double step)
    {
        if (Math.Abs(value) < Math.Abs(step) * 1e-6)
        {
            value = 0;
        }

        string stepText = Math.Abs(step).ToString("G10", CultureInfo.InvariantCulture);
        if (stepText.Contains('E', StringComparison.Ordinal))
        {
            return value.ToString("G6", CultureInfo.InvariantCulture);
        }

        int point = stepText.IndexOf('.', StringComparison.Ordinal);
        int decimals = point < 0 ? 0 : stepText.Length - point - 1;
        return value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
    }
}
