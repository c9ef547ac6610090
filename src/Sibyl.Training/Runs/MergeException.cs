namespace Sibyl.Training.Runs;

/// <summary>Shard outputs cannot be merged; <see cref="Problems"/> says exactly what is missing or wrong.</summary>
public sealed class MergeException : Exception
{
    /// <summary>Creates the exception.</summary>
    public MergeException(IReadOnlyList<string> problems)
        : base($"cannot merge:{Environment.NewLine}  {string.Join(Environment.NewLine + "  ", problems)}")
    {
        Problems = problems;
    }

    /// <summary>One line per problem.</summary>
    public IReadOnlyList<string> Problems { get; }
}
