using System.Globalization;
using System.Text;
using Sibyl.Training.Storage;

namespace Sibyl.Cli.Output;

/// <summary>
/// A CSV table of numbers with a header row, written in the invariant culture with round-trip precision
/// (a decimal comma or a truncated digit corrupts science). Files are written atomically.
/// </summary>
internal sealed class CsvTable(IReadOnlyList<string> columns)
{
    private readonly List<double[]> _rows = [];

    public void Add(params double[] row)
    {
        if (row.Length != columns.Count)
        {
            throw new ArgumentException($"row has {row.Length} values for {columns.Count} columns", nameof(row));
        }

        _rows.Add(row);
    }

    public void Write(TextWriter writer)
    {
        writer.Write(string.Join(",", columns));
        writer.Write('\n');
        var line = new StringBuilder();
        foreach (var row in _rows)
        {
            line.Clear();
            for (int i = 0; i < row.Length; i++)
            {
                if (i > 0)
                {
                    line.Append(',');
                }

                line.Append(row[i].ToString("R", CultureInfo.InvariantCulture));
            }

            line.Append('\n');
            writer.Write(line);
        }
    }

    /// <summary>Writes to a temporary file beside <paramref name="path"/> and renames it into place.</summary>
    public void WriteFile(string path)
    {
        using var buffer = new MemoryStream();
        using (var writer = new StreamWriter(buffer, new UTF8Encoding(false), bufferSize: -1, leaveOpen: true))
        {
            Write(writer);
        }

        AtomicFile.WriteAllBytes(path, buffer.ToArray());
    }
}
