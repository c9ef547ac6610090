namespace Sibyl.Training.Specs;

/// <summary>A grid spec is invalid; <see cref="Problems"/> holds one clear line per problem found.</summary>
public sealed class GridSpecException : Exception
{
    /// <summary>Creates the exception from the problems of the spec at <paramref name="source"/>.</summary>
    public GridSpecException(string source, IReadOnlyList<string> problems)
        : base($"{source}: {problems.Count} problem{(problems.Count == 1 ? "" : "s")}:{Environment.NewLine}  {string.Join(Environment.NewLine + "  ", problems)}")
    {
        Source = source;
        Problems = problems;
    }

    /// <summary>Where the spec came from (a path).</summary>
    public new string Source { get; }

    /// <summary>Each problem, naming the field and what is allowed.</summary>
    public IReadOnlyList<string> Problems { get; }
}
