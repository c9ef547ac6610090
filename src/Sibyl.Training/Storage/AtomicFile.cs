namespace Sibyl.Training.Storage;

/// <summary>
/// Writes a file so that readers only ever see the old contents or the complete new ones: the bytes go to a hidden,
/// uniquely named temporary file in the same folder (so the rename stays on one file system and is atomic, and two
/// writers of the same file never share a temporary), are flushed to disk, and are then moved over the target.
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="contents"/> to <paramref name="path"/> atomically.</summary>
    /// <exception cref="IOException">The folder is missing or the file cannot be written.</exception>
    public static void WriteAllBytes(string path, ReadOnlySpan<byte> contents)
    {
        string fullPath = Path.GetFullPath(path);
        string folder = Path.GetDirectoryName(fullPath) ?? throw new ArgumentException($"'{path}' names a root folder, not a file.", nameof(path));
        if (!Directory.Exists(folder))
        {
            throw new DirectoryNotFoundException($"cannot write '{path}': its folder '{folder}' does not exist");
        }

        string temporary = Path.Combine(folder, $".{Path.GetFileName(fullPath)}.{Guid.NewGuid():N}.tmp");
        bool moved = false;
        try
        {
            using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                stream.Write(contents);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temporary, fullPath, overwrite: true);
            moved = true;
        }
        finally
        {
            if (!moved)
            {
                TryDelete(temporary);
            }
        }
    }

    private static void TryDelete(string temporary)
    {
        try
        {
            File.Delete(temporary);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The original failure is what the caller needs to see; a stray hidden .tmp file is harmless.
        }
    }
}
