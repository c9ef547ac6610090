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

    /// <summary>Observable names of the basis layout.</summary>
    [Key(5)]
    public string[] Observables { get; set; } = [];

    /// <summary>Nuisance-parameter names of the basis layout.</summary>
    [Key(6)]
    public string[] Nuisance { get; set; } = [];

    /// <summary>Basis term names.</summary>
    [Key(7)]
    public string[] TermNames { get; set; } = [];

    /// <summary>Observable index of each term.</summary>
    [Key(8)]
    public int[] TermObservables { get; set; } = [];

    /// <summary>Fixed prefactor of each term.</summary>
    [Key(9)]
    public double[] TermPrefactors { get; set; } = [];

    /// <summary>Nuisance factors of each term.</summary>
    [Key(10)]
    public int[][] TermFactors { get; set; } = [];

    /// <summary>Per point: redshift-major, term-major values over k, or null when it failed.</summary>
    [Key(11)]
    public double[]?[] Values { get; set; } = [];

    /// <summary>Per point: null, or what went wrong.</summary>
    [Key(12)]
    public string?[] Errors { get; set; } = [];
}
