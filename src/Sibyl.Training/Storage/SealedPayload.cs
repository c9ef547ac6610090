namespace Sibyl.Training.Storage;

/// <summary>
/// The checked content of a sealed file. The header's format version is checked on reading (<see cref="SealedFile.Open"/>)
/// but not carried here: every reader so far reads all versions alike.
/// </summary>
/// <param name="Payload">The MessagePack bytes.</param>
/// <param name="Hash">SHA-256 of the payload, lower-case hex: the identity of the content.</param>
public sealed record SealedPayload(ReadOnlyMemory<byte> Payload, string Hash);
