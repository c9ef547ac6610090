using System.Globalization;
using System.Text;
using Sibyl.Demo.Sampling;

namespace Sibyl.Demo.Commands;

/// <summary>The chain as CSV: step, walker, ln posterior, then one column per parameter; one row per walker per step.</summary>
public static class ChainFile
{
    /// <summary>Writes the chain.</summary>
    public static void Write(string path, EnsembleChain chain, IReadOnlyList<string> names, string header)
    {
        ArgumentNullException.ThrowIfNull(chain);
        ArgumentNullException.ThrowIfNull(names);
        var text = new StringBuilder();
        text.Append("# ").AppendLine(header);
        text.Append("step,walker,ln_posterior,").AppendLine(string.Join(',', names));
        for (int s = 0; s < chain.Steps; s++)
        {
            for (int w = 0; w < chain.Walkers; w++)
            {
                text.Append(s.ToString(CultureInfo.InvariantCulture)).Append(',').Append(w.ToString(CultureInfo.InvariantCulture)).Append(',')
                    .Append(chain.LogDensity(s, w).ToString("R", CultureInfo.InvariantCulture));
                foreach (double v in chain.Position(s, w))
                {
                    text.Append(',').Append(v.ToString("R", CultureInfo.InvariantCulture));
                }

                text.AppendLine();
            }
        }

        File.WriteAllText(path, text.ToString());
    }

    /// <summary>Reads the parameter names and the samples of steps from <paramref name="burnIn"/> on (null: the second half).</summary>
    /// <exception cref="InvalidDataException">Malformed.</exception>
    public static (string[] Names, List<double[]> Samples) Read(string path, int? burnIn)
    {
        var rows = File.ReadLines(path).Where(l => l.Length > 0 && !l.StartsWith('#')).Select(l => l.Split(',')).ToList();
        if (rows.Count < 2 || rows[0].Length < 4)
        {
            throw new InvalidDataException($"{path}: not a chain file");
        }

        string[] names = rows[0][3..];
        var parsed = rows.Skip(1).Select(r => r.Select(c => double.Parse(c, NumberStyles.Float, CultureInfo.InvariantCulture)).ToArray()).ToList();
        int lastStep = (int)parsed[^1][0];
        int from = burnIn ?? ((lastStep + 1) / 2);
        return (names, [.. parsed.Where(r => r[0] >= from).Select(r => r[3..])]);
    }
}
