namespace Sibyl.Training.Storage;

/// <summary>The checked content of a sealed file.</summary>
/// <param name="Version">Format version from the header.</param>
/// <param name="Payload">The MessagePack bytes.</param>
/// <param name="Hash">SHA-256 of the payload, lower-case hex: the identity of the content.</param>
public sealed record SealedPayload(int Version, ReadOnlyMemory<byte> Payload, string Hash);
