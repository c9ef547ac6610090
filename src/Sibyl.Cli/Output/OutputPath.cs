using Sibyl.Cli.Arguments;

namespace Sibyl.Cli.Output;

/// <summary>Checks output paths before any work is done.</summary>
internal static class OutputPath
{
    /// <summary>Fails early if <paramref name="path"/>'s folder does not exist (the usual mistake: a misspelt folder).</summary>
    public static void RequireFolder(string path, string option)
    {
        string directory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        if (!Directory.Exists(directory))
        {
            throw new UsageException($"{option}: folder {directory} does not exist");
        }
    }
}
