namespace Sibyl.Plotting;

/// <summary>
/// Writes a file so that readers only ever see the old contents or the complete new ones: the bytes go to a
/// temporary file in the same folder (so the final rename stays on one file system and is atomic) and are flushed
/// to disk before that file is moved over the target.
/// </summary>
internal static class AtomicFile
{
    /// <summary>
    /// Fails before any work is done when the target's folder is missing, which is the usual mistake
    /// (a misspelt or not yet created output folder).
    /// </summary>
    public static void RequireFolder(string path)
    {
        string folder = FolderOf(Path.GetFullPath(path), path);
        if (!Directory.Exists(folder))
        {
            throw new DirectoryNotFoundException($"Cannot save '{path}': its folder '{folder}' does not exist.");
        }
    }

    public static void WriteAllBytes(string path, byte[] contents)
    {
        string fullPath = Path.GetFullPath(path);
        string folder = FolderOf(fullPath, path);

        // Hidden and unique, so a leftover from a killed run is neither mistaken for a figure nor overwritten by another run.
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
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new IOException($"Cannot save '{path}': {e.Message}", e);
        }
        finally
        {
            if (!moved)
            {
                TryDelete(temporary);
            }
        }
    }

    private static string FolderOf(string fullPath, string path) =>
        Path.GetDirectoryName(fullPath)
            ?? throw new ArgumentException($"'{path}' names a root folder, not a file.", nameof(path));

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
