using MessagePack;

namespace Sibyl.Training.Storage;

/// <summary>
/// MessagePack settings for every Sibyl file: the untrusted-data security mode (bounded nesting, hash-collision
/// resistant maps), because design, chunk, training and emulator files travel between machines and users, and a
/// payload that fails to parse becomes a <see cref="CorruptFileException"/> naming the file.
/// </summary>
public static class Packing
{
    private static readonly MessagePackSerializerOptions Options =
        MessagePackSerializerOptions.Standard.WithSecurity(MessagePackSecurity.UntrustedData);

    /// <summary>Serialises a contract.</summary>
    public static byte[] Pack<T>(T value) => MessagePackSerializer.Serialize(value, Options);

    /// <summary>Deserialises a contract from a checked payload.</summary>
    /// <exception cref="CorruptFileException">The payload is not a valid <typeparamref name="T"/>.</exception>
    public static T Unpack<T>(SealedPayload sealedPayload, string source)
        where T : class
    {
        ArgumentNullException.ThrowIfNull(sealedPayload);
        try
        {
            return MessagePackSerializer.Deserialize<T>(sealedPayload.Payload, Options)
                   ?? throw new CorruptFileException(source, "corrupted: empty content");
        }
        catch (MessagePackSerializationException e)
        {
            throw new CorruptFileException(source, $"corrupted: its content does not parse ({e.InnerException?.Message ?? e.Message})", e);
        }
    }
}
