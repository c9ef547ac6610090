using System.Globalization;

namespace Sibyl.Cli.Arguments;

/// <summary>
/// Reads a user's linear spectrum: two columns k [h/Mpc] and P [(Mpc/h)³] separated by commas or
/// whitespace; lines starting with '#' and one non-numeric line before the data (a header) are skipped.
/// </summary>
internal static class LinearTableReader
{
    public static (double[] K, double[] P) Read(string path)
    {
        if (!File.Exists(path))
        {
            throw new UsageException($"--table: file '{path}' not found");
        }

        var k = new List<double>();
        var p = new List<double>();
        int lineNumber = 0;
        bool headerSkipped = false;
        foreach (string raw in File.ReadLines(path))
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

                throw new UsageException($"--table: {path} line {lineNumber}: expected two numbers k, P, got '{raw}'");
            }

            k.Add(kValue);
            p.Add(pValue);
        }

        return (k.ToArray(), p.ToArray());
    }

    private static bool TryNumber(string text, out double value) =>
        double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value);
}
