namespace Sibyl.Cli.Arguments;

/// <summary>Bad command-line input: printed as one line, exit code 2.</summary>
internal sealed class UsageException(string message) : Exception(message);
