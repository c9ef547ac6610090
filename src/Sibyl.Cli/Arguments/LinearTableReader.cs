using Sibyl.Training.Linear;

namespace Sibyl.Cli.Arguments;

/// <summary>Reads a user's linear-spectrum file for <c>--table</c> (format in <see cref="LinearTableText"/>).</summary>
internal static class LinearTableReader
{
    public static (double[] K, double[] P) Read(string path)
    {
        if (!File.Exists(path))
        {
            throw new UsageException($"--table: file '{path}' not found");
        }

        try
        {
            return LinearTableText.Parse(File.ReadLines(path), path);
        }
        catch (FormatException e)
        {
            throw new UsageException($"--table: {e.Message}");
        }
    }
}
