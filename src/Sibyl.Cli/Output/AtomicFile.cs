using Sibyl.Cli.Arguments;

namespace Sibyl.Cli.Output;

/// <summary>Writes a file so that readers see either the old content or the complete new one.</summary>
internal static class AtomicFile
{
    /// <summary>Fails early, before any work is done, if <paramref name="path"/>'s folder does not exist.</summary>
    public static void RequireFolder(string path, string option)
    {
        string directory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
        if (!Directory.Exists(directory))
        {
            throw new UsageException($"{option}: folder {directory} does not exist");
        }
    }

    public static void Write(string path, Action<Stream> write)
    {
        string full = Path.GetFullPath(path);
        string directory = Path.GetDirectoryName(full) ?? ".";
        RequireFolder(path, path);

        string temporary = Path.Combine(directory, $".{Path.GetFileName(full)}.{Guid.NewGuid():N}.tmp");
        try
        {
            using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temporary, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(temporary))
            {
                File.Delete(temporary);
            }
        }
    }
}
