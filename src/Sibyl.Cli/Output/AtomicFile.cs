using Sibyl.Cli.Arguments;

namespace Sibyl.Cli.Output;

/// <summary>Writes a file so that readers see either the old content or the complete new one.</summary>
internal static class AtomicFile
{
    public static void Write(string path, Action<Stream> write)
    {
        string full = Path.GetFullPath(path);
        string directory = Path.GetDirectoryName(full) ?? ".";
        if (!Directory.Exists(directory))
        {
            throw new UsageException($"{path}: folder {directory} does not exist");
        }

        string temporary = Path.Combine(directory, $".{Path.GetFileName(full)}.{Environment.ProcessId}.tmp");
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
