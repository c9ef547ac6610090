namespace Sibyl.Training.Storage;

/// <summary>A file is not a Sibyl file of the expected kind, is truncated, corrupted or from a newer version.</summary>
public sealed class CorruptFileException : IOException
{
    /// <summary>Creates the exception; the message starts with the path.</summary>
    public CorruptFileException(string path, string problem)
        : base($"{path}: {problem}")
    {
        Path = path;
    }

    /// <summary>Creates the exception with the underlying cause.</summary>
    public CorruptFileException(string path, string problem, Exception inner)
        : base($"{path}: {problem}", inner)
    {
        Path = path;
    }

    /// <summary>The offending file.</summary>
    public string Path { get; }
}
