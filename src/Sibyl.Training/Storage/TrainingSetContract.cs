using MessagePack;

namespace Sibyl.Training.Storage;

/// <summary>The stored form of a merged training set (format version 1).</summary>
[MessagePackObject]
public sealed class TrainingSetContract
{
    /// <summary>Canonical spec JSON.</summary>
    [Key(0)]
    public string SpecJson { get; set; } = "";

    /// <summary>SHA-256 of <see cref="SpecJson"/>.</summary>
    [Key(1)]
    public string SpecHash { get; set; } = "";

    /// <summary>Hash of the design the points come from.</summary>
    [Key(2)]
    public string DesignHash { get; set; } = "";

    /// <summary>Code fingerprint shared by every point.</summary>
    [Key(3)]
    public string CodeFingerprint { get; set; } = "";

    /// <summary>Unit-cube coordinates of every point (training, then held out), row-major.</summary>
    [Key(4)]
    public double[] Unit { get; set; } = [];

    /// <summary>The basis layout of every point's spectra.</summary>
    [Key(5)]
    public BasisLayoutContract Layout { get; set; } = new();

    /// <summary>Per point: redshift-major, term-major values over k, or null when it failed.</summary>
    [Key(6)]
    public double[]?[] Values { get; set; } = [];

    /// <summary>Per point: null, or what went wrong.</summary>
    [Key(7)]
    public string?[] Errors { get; set; } = [];
}
