using System.Globalization;
using Sibyl.Training.Design;

namespace Sibyl.Training.Storage;

/// <summary>
/// One chunk of a run on disk: <c>chunk-NNNNNN.sibyl</c> in the run folder. The name fixes the chunk's points, so
/// shards and re-runs that write the same chunk write the same file, atomically, with the same content.
/// </summary>
public static class ChunkFile
{
    /// <summary>Format version written by this build.</summary>
    public const int FormatVersion = 1;

    /// <summary>File-name pattern of chunks, for enumerating a run folder.</summary>
    public const string Pattern = "chunk-*.sibyl";

    /// <summary>The file of chunk <paramref name="chunk"/> in <paramref name="folder"/>.</summary>
    public static string PathOf(string folder, int chunk) =>
        Path.Combine(folder, string.Create(CultureInfo.InvariantCulture, $"chunk-{chunk:D6}.sibyl"));

    /// <summary>Writes a chunk atomically.</summary>
    public static void Write(string folder, ChunkContract chunk)
    {
        ArgumentNullException.ThrowIfNull(chunk);
        SealedFile.Write(PathOf(folder, chunk.Chunk), FileKind.Chunk, FormatVersion, Packing.Pack(chunk));
    }

    /// <summary>Reads a chunk and checks that it belongs to <paramref name="design"/> and is complete.</summary>
    /// <exception cref="CorruptFileException">Not a chunk, damaged, of another design, or inconsistent.</exception>
    public static ChunkContract Read(string path, TrainingDesign design, int valuesPerPoint)
    {
        ArgumentNullException.ThrowIfNull(design);
        var chunk = Packing.Unpack<ChunkContract>(SealedFile.Read(path, FileKind.Chunk, FormatVersion), path);
        if (chunk.DesignHash != design.Hash)
        {
            throw new CorruptFileException(path, $"belongs to another design (design hash {Short(chunk.DesignHash)}, expected {Short(design.Hash)})");
        }

        if (chunk.Chunk < 0 || chunk.Chunk >= design.ChunkCount || PathOf(Path.GetDirectoryName(path) ?? ".", chunk.Chunk) != Path.Combine(Path.GetDirectoryName(path) ?? ".", Path.GetFileName(path)))
        {
            throw new CorruptFileException(path, $"holds chunk {chunk.Chunk}, which does not match its file name or the design's {design.ChunkCount} chunks");
        }

        var (start, end) = design.ChunkRange(chunk.Chunk);
        bool consistent = chunk.Values.Length == end - start && chunk.Errors.Length == end - start;
        for (int i = 0; consistent && i < chunk.Values.Length; i++)
        {
            consistent = chunk.Values[i] is { } v ? v.Length == valuesPerPoint && chunk.Errors[i] is null : chunk.Errors[i] is not null;
        }

        if (!consistent)
        {
            throw new CorruptFileException(path, $"inconsistent: expected {end - start} points of {valuesPerPoint} values or an error each");
        }

        return chunk;
    }

    private static string Short(string hash) => hash.Length > 12 ? hash[..12] : hash;
}
