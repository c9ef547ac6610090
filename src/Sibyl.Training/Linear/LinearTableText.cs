using System.Globalization;

namespace Sibyl.Training.Linear;

/// <summary>
/// Parses a linear spectrum written as text: two columns k [h/Mpc] and P [(Mpc/h)³] separated by commas,
/// semicolons or whitespace; blank lines, lines starting with '#' and one non-numeric line before the data
/// (a header) are skipped. Used for <c>--table</c> files and for the output of a user's linear-spectrum program.
/// </summary>
public static class LinearTableText
{
    /// <summary>Reads the rows; <paramref name="source"/> names the text in messages.</summary>
    /// <exception cref="FormatException">A line is not two numbers, or there are no rows; the message names the line.</exception>
    public static (double[] K, double[] P) Parse(IEnumerable<string> lines, string source)
    {
        ArgumentNullException.ThrowIfNull(lines);
        var k = new List<double>();
        var p = new List<double>();
        int lineNumber = 0;
        bool headerSkipped = false;
        foreach (string raw in lines)
        {
            lineNumber++;
            string line = raw.Trim();
            if (line.Length == 0 || line.StartsWith('#'))
            {
                continue;
            }

            string[] fields = line.Split([',', ' ', '\t', ';'], StringSplitOptions.RemoveEmptyEntries);
            if (fields.Length < 2 || !TryNumber(fields[0], out double kValue) || !TryNumber(fields[1], out double pValue))
            {
                if (k.Count == 0 && !headerSkipped)
                {
                    headerSkipped = true;
                    continue;
                }

                throw new FormatException($"{source} line {lineNumber}: expected two numbers k, P, got '{Shorten(raw)}'");
            }

            k.Add(kValue);
            p.Add(pValue);
        }

        if (k.Count == 0)
        {
            throw new FormatException($"{source}: no rows of k, P");
        }

        return (k.ToArray(), p.ToArray());
    }

    private static bool TryNumber(string text, out double value) =>
        double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value);

    private static string Shorten(string text) => text.Length <= 80 ? text : text[..80] + "…";
}
