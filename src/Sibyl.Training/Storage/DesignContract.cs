using MessagePack;

namespace Sibyl.Training.Storage;

/// <summary>The stored form of a design (format version 1). Points are unit-cube coordinates, row-major.</summary>
[MessagePackObject]
public sealed class DesignContract
{
    /// <summary>Canonical spec JSON.</summary>
    [Key(0)]
    public string SpecJson { get; set; } = "";

    /// <summary>SHA-256 of <see cref="SpecJson"/>.</summary>
    [Key(1)]
    public string SpecHash { get; set; } = "";

    /// <summary>Training points, then held-out points, each <c>dimensions</c> unit-cube coordinates.</summary>
    [Key(2)]
    public double[] Unit { get; set; } = [];

    /// <summary>φ_p of the training design before and after the maximin improvement.</summary>
    [Key(3)]
    public double[] Criterion { get; set; } = [];

    /// <summary>Smallest pairwise distance of the training design in the unit cube.</summary>
    [Key(4)]
    public double MinimumDistance { get; set; }
}
