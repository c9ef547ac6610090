using MessagePack;

namespace Sibyl.Training.Storage;

/// <summary>The stored form of one chunk of a run (format version 1).</summary>
[MessagePackObject]
public sealed class ChunkContract
{
    /// <summary>Hash of the design the points come from.</summary>
    [Key(0)]
    public string DesignHash { get; set; } = "";

    /// <summary><see cref="CodeFingerprint"/> of the build that computed them.</summary>
    [Key(1)]
    public string CodeFingerprint { get; set; } = "";

    /// <summary>Chunk index in the design.</summary>
    [Key(2)]
    public int Chunk { get; set; }

    /// <summary>Shard that computed it (I of I/N).</summary>
    [Key(3)]
    public int Shard { get; set; }

    /// <summary>Number of shards of that run (N of I/N).</summary>
    [Key(4)]
    public int ShardCount { get; set; }

    /// <summary>Per point of the chunk, in index order: the values, or null when the point failed.</summary>
    [Key(5)]
    public double[]?[] Values { get; set; } = [];

    /// <summary>Per point: null when it succeeded, else what went wrong.</summary>
    [Key(6)]
    public string?[] Errors { get; set; } = [];
}
