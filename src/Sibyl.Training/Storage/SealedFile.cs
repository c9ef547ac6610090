using System.Buffers.Binary;
using System.Security.Cryptography;
using System.Text;

namespace Sibyl.Training.Storage;

/// <summary>
/// The envelope of every Sibyl data file: an 8-byte signature, a four-letter kind, the format version, the
/// payload length and its SHA-256, then the payload (MessagePack). A reader can therefore tell a foreign file,
/// a file of another kind, a newer format, a truncated file and a corrupted one apart before it parses a
/// single byte of payload, and say which it is.
/// </summary>
public static class SealedFile
{
    /// <summary>Header length in bytes.</summary>
    public const int HeaderLength = 8 + 4 + 4 + 8 + 32;

    // "SIBYL", then CR LF and Ctrl-Z so that text-mode transfers and `type` on a console show themselves at once.
    private static ReadOnlySpan<byte> Signature => "SIBYL\r\n\u001a"u8;

    /// <summary>Header plus payload.</summary>
    public static byte[] Seal(FileKind kind, int version, ReadOnlySpan<byte> payload)
    {
        var bytes = new byte[HeaderLength + payload.Length];
        var span = bytes.AsSpan();
        Signature.CopyTo(span);
        Encoding.ASCII.GetBytes(Tag(kind), span.Slice(8, 4));
        BinaryPrimitives.WriteInt32LittleEndian(span.Slice(12, 4), version);
        BinaryPrimitives.WriteInt64LittleEndian(span.Slice(16, 8), payload.Length);
        SHA256.HashData(payload, span.Slice(24, 32));
        payload.CopyTo(span[HeaderLength..]);
        return bytes;
    }

    /// <summary>Writes a sealed file atomically.</summary>
    public static void Write(string path, FileKind kind, int version, ReadOnlySpan<byte> payload) =>
        AtomicFile.WriteAllBytes(path, Seal(kind, version, payload));

    /// <summary>Reads and checks a sealed file of kind <paramref name="kind"/>.</summary>
    /// <exception cref="CorruptFileException">Foreign, other kind, newer, truncated or corrupted.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static SealedPayload Read(string path, FileKind kind, int newestVersion) => Open(File.ReadAllBytes(path), path, kind, newestVersion);

    /// <summary>Checks sealed bytes; <paramref name="source"/> names them in messages.</summary>
    /// <exception cref="CorruptFileException">Foreign, other kind, newer, truncated or corrupted.</exception>
    public static SealedPayload Open(byte[] bytes, string source, FileKind kind, int newestVersion)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        var span = bytes.AsSpan();
        if (span.Length < Signature.Length || !span[..Signature.Length].SequenceEqual(Signature))
        {
            throw new CorruptFileException(source, "not a Sibyl file (its first bytes are not the Sibyl signature)");
        }

        if (span.Length < HeaderLength)
        {
            throw new CorruptFileException(source, $"truncated: {span.Length} bytes, shorter than the {HeaderLength}-byte header");
        }

        string tag = Encoding.ASCII.GetString(span.Slice(8, 4));
        if (tag != Tag(kind))
        {
            string found = Enum.GetValues<FileKind>().Where(k => Tag(k) == tag).Select(Describe).FirstOrDefault() ?? $"an unknown kind '{tag}'";
            throw new CorruptFileException(source, $"is {found}, not {Describe(kind)}");
        }

        int version = BinaryPrimitives.ReadInt32LittleEndian(span.Slice(12, 4));
        if (version < 1 || version > newestVersion)
        {
            throw new CorruptFileException(source, $"format version {version}; this build of Sibyl reads {Describe(kind)} versions 1 to {newestVersion} (a newer Sibyl wrote it?)");
        }

        long length = BinaryPrimitives.ReadInt64LittleEndian(span.Slice(16, 8));
        long present = span.Length - HeaderLength;
        if (length != present)
        {
            string what = length > present ? "truncated" : "has trailing bytes";
            throw new CorruptFileException(source, $"{what}: the header promises {length} bytes of data, the file holds {present}");
        }

        var payload = span[HeaderLength..];
        Span<byte> hash = stackalloc byte[32];
        SHA256.HashData(payload, hash);
        if (!hash.SequenceEqual(span.Slice(24, 32)))
        {
            throw new CorruptFileException(source, "corrupted: the data do not match the checksum in the header");
        }

        return new SealedPayload(bytes.AsMemory(HeaderLength), Convert.ToHexStringLower(span.Slice(24, 32)));
    }

    private static string Tag(FileKind kind) => kind switch
    {
        FileKind.Design => "DSGN",
        FileKind.Chunk => "CHNK",
        FileKind.TrainingSet => "TSET",
        FileKind.Emulator => "EMUL",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    private static string Describe(FileKind kind) => kind switch
    {
        FileKind.Design => "a design",
        FileKind.Chunk => "a chunk of a training run",
        FileKind.TrainingSet => "a training set",
        _ => "an emulator",
    };
}
