using MessagePack;
using Sibyl.Training.Storage;

namespace Sibyl.Emulation.Emulators;

/// <summary>The stored form of an emulator (format version 1): everything prediction needs, and its measured accuracy.</summary>
[MessagePackObject]
public sealed class EmulatorContract
{
    /// <summary>Canonical JSON of the grid spec it was trained on.</summary>
    [Key(0)]
    public string SpecJson { get; set; } = "";

    /// <summary>Hash of the design of its training set.</summary>
    [Key(1)]
    public string DesignHash { get; set; } = "";

    /// <summary>Code fingerprint of the build that computed the training set.</summary>
    [Key(2)]
    public string CodeFingerprint { get; set; } = "";

    /// <summary>Varied parameters, in input order.</summary>
    [Key(3)]
    public string[] ParameterNames { get; set; } = [];

    /// <summary>Lower edges of the box.</summary>
    [Key(4)]
    public double[] Min { get; set; } = [];

    /// <summary>Upper edges of the box.</summary>
    [Key(5)]
    public double[] Max { get; set; } = [];

    /// <summary>Wavenumbers, h/Mpc.</summary>
    [Key(6)]
    public double[] K { get; set; } = [];

    /// <summary>The redshift of each slice; empty when z is an input (one slice).</summary>
    [Key(7)]
    public double[] Redshifts { get; set; } = [];

    /// <summary>The basis layout of the predicted spectra.</summary>
    [Key(8)]
    public BasisLayoutContract Layout { get; set; } = new();

    /// <summary>Unit-box coordinates of the training points, row-major.</summary>
    [Key(9)]
    public double[] TrainingInputs { get; set; } = [];

    /// <summary>One block per slice and term (index slice·terms + term).</summary>
    [Key(10)]
    public BlockContract[] Blocks { get; set; } = [];

    /// <summary>The Gaussian processes.</summary>
    [Key(11)]
    public ProcessContract[] Processes { get; set; } = [];

    /// <summary>Accuracy measured on the held-out points when it was fitted.</summary>
    [Key(12)]
    public AccuracyContract Accuracy { get; set; } = new();

    /// <summary><see cref="InputWarp"/> of each parameter, as integers.</summary>
    [Key(13)]
    public int[] InputWarps { get; set; } = [];
}

/// <summary>One basis term at one slice: its transform and principal components.</summary>
[MessagePackObject]
public sealed class BlockContract
{
    /// <summary><see cref="TargetTransform"/> as an integer.</summary>
    [Key(0)]
    public int Transform { get; set; }

    /// <summary>Per-k mean.</summary>
    [Key(1)]
    public double[] Mean { get; set; } = [];

    /// <summary>Per-k scale.</summary>
    [Key(2)]
    public double[] Scale { get; set; } = [];

    /// <summary>Components, component-major.</summary>
    [Key(3)]
    public double[] Basis { get; set; } = [];

    /// <summary>Singular values of the kept components.</summary>
    [Key(4)]
    public double[] SingularValues { get; set; } = [];

    /// <summary>Largest reconstruction error on the training set, transformed units.</summary>
    [Key(5)]
    public double MaximumError { get; set; }

    /// <summary>RMS reconstruction error on the training set.</summary>
    [Key(6)]
    public double RmsError { get; set; }

    /// <summary>Fraction of variance kept.</summary>
    [Key(7)]
    public double ExplainedFraction { get; set; }
}

/// <summary>One Gaussian process and the block components it predicts.</summary>
[MessagePackObject]
public sealed class ProcessContract
{
    /// <summary>Kernel as an integer.</summary>
    [Key(0)]
    public int Kernel { get; set; }

    /// <summary>σ_f².</summary>
    [Key(1)]
    public double SignalVariance { get; set; }

    /// <summary>Length scales, unit-box units.</summary>
    [Key(2)]
    public double[] LengthScales { get; set; } = [];

    /// <summary>σ_n².</summary>
    [Key(3)]
    public double NoiseVariance { get; set; }

    /// <summary>α per output, output-major.</summary>
    [Key(4)]
    public double[] Alpha { get; set; } = [];

    /// <summary>Output standardization means.</summary>
    [Key(5)]
    public double[] OutputMean { get; set; } = [];

    /// <summary>Output standardization scales.</summary>
    [Key(6)]
    public double[] OutputScale { get; set; } = [];

    /// <summary>Cholesky factor (row-major), or null when variances were not kept.</summary>
    [Key(7)]
    public double[]? Cholesky { get; set; }

    /// <summary>Log marginal likelihood at the fit.</summary>
    [Key(8)]
    public double LogMarginalLikelihood { get; set; }

    /// <summary>Degree of the polynomial trend.</summary>
    [Key(9)]
    public int TrendDegree { get; set; }

    /// <summary>Trend coefficients, feature-major.</summary>
    [Key(10)]
    public double[] TrendCoefficients { get; set; } = [];

    /// <summary>Block of each output.</summary>
    [Key(11)]
    public int[] OutputBlocks { get; set; } = [];

    /// <summary>Component (within its block) of each output.</summary>
    [Key(12)]
    public int[] OutputComponents { get; set; } = [];
}

/// <summary>Error percentiles per term and k, and the worst points.</summary>
[MessagePackObject]
public sealed class AccuracyContract
{
    /// <summary>Where the comparison points came from ("held-out", "fresh direct runs").</summary>
    [Key(0)]
    public string Source { get; set; } = "";

    /// <summary>Number of points compared.</summary>
    [Key(1)]
    public int Points { get; set; }

    /// <summary>Per term and k ([t·nk + i]): 50th percentile of the error.</summary>
    [Key(2)]
    public double[] P50 { get; set; } = [];

    /// <summary>90th percentile.</summary>
    [Key(3)]
    public double[] P90 { get; set; } = [];

    /// <summary>99th percentile.</summary>
    [Key(4)]
    public double[] P99 { get; set; } = [];

    /// <summary>Largest error.</summary>
    [Key(5)]
    public double[] Max { get; set; } = [];

    /// <summary>Per term: true when the error is relative (positive term), false when in units of the term's RMS at k.</summary>
    [Key(6)]
    public bool[] Relative { get; set; } = [];

    /// <summary>The worst points, one line each.</summary>
    [Key(7)]
    public string[] Worst { get; set; } = [];
}
