using System.Globalization;

namespace Sibyl.Training.Runs;

/// <summary>
/// Which chunks one process computes: shard I of N owns the chunks c with c mod N = I, so N independent tasks of
/// a batch scheduler's job array cover a design exactly once with no coordinator, and neighbouring chunks (which
/// often cost about the same) are spread over the tasks.
/// </summary>
/// <param name="Index">I, from 0 to N − 1.</param>
/// <param name="Count">N, at least 1.</param>
public sealed record ShardSelection(int Index, int Count)
{
    /// <summary>The whole design in one process.</summary>
    public static ShardSelection All { get; } = new(0, 1);

    /// <summary>True when this shard computes chunk <paramref name="chunk"/>.</summary>
    public bool Owns(int chunk) => chunk % Count == Index;

    /// <summary>The shard that owns chunk <paramref name="chunk"/> when there are <paramref name="count"/> shards.</summary>
    public static int OwnerOf(int chunk, int count) => chunk % count;

    /// <summary>Parses "I/N" with 0 ≤ I &lt; N.</summary>
    /// <exception cref="FormatException">Not of that form; the message says what is allowed.</exception>
    public static ShardSelection Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        string[] parts = text.Split('/');
        if (parts.Length != 2
            || !int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out int index)
            || !int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out int count)
            || count < 1 || index >= count)
        {
            throw new FormatException($"'{text}' must be I/N with N >= 1 and 0 <= I < N (for a job array numbered from 0: the task's index / the number of shards)");
        }

        return new ShardSelection(index, count);
    }

    /// <inheritdoc/>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
