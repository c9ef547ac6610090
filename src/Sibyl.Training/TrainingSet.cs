using Sibyl.Perturbation.Spectra;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Training;

/// <summary>
/// A merged training set: the spec, every point's coordinates and role (training or held out), and its basis
/// spectra at each of its redshifts, or the error that stopped its calculation. Self-contained: fitting needs
/// no other file.
/// </summary>
public sealed class TrainingSet
{
    /// <summary>Format version written by this build.</summary>
    public const int FormatVersion = 1;

    private readonly TrainingSetContract _contract;
    private readonly double[] _k;

    internal TrainingSet(TrainingSetContract contract, GridSpec spec, BasisLayout layout)
    {
        _contract = contract;
        Spec = spec;
        Layout = layout;
        _k = [.. spec.K];
    }

    /// <summary>The spec the design was drawn from.</summary>
    public GridSpec Spec { get; }

    /// <summary>Terms of every spectrum.</summary>
    public BasisLayout Layout { get; }

    /// <summary>Hash of the design.</summary>
    public string DesignHash => _contract.DesignHash;

    /// <summary>Fingerprint of the build that computed every point.</summary>
    public string CodeFingerprint => _contract.CodeFingerprint;

    /// <summary>All points, training first.</summary>
    public int Count => _contract.Values.Length;

    /// <summary>Wavenumbers in h/Mpc.</summary>
    public ReadOnlySpan<double> K => _k;

    /// <summary>Parameter values of point <paramref name="index"/>, in spec order.</summary>
    public double[] Parameters(int index)
    {
        int d = Spec.Varied.Count;
        var values = new double[d];
        for (int c = 0; c < d; c++)
        {
            values[c] = Spec.Varied[c].FromUnit(_contract.Unit[(index * d) + c]);
        }

        return values;
    }

    /// <summary>Unit-cube coordinates of point <paramref name="index"/>.</summary>
    public ReadOnlySpan<double> Unit(int index) => _contract.Unit.AsSpan(index * Spec.Varied.Count, Spec.Varied.Count);

    /// <summary>True for training points, false for held-out ones.</summary>
    public bool IsTraining(int index) => index < Spec.TrainingPoints;

    /// <summary>The error of a failed point, or null.</summary>
    public string? Error(int index) => _contract.Errors[index];

    /// <summary>Every value of point <paramref name="index"/>: redshift-major, then term-major over k.</summary>
    /// <exception cref="InvalidOperationException">The point failed.</exception>
    public ReadOnlySpan<double> Values(int index) =>
        _contract.Values[index] ?? throw new InvalidOperationException($"point {index} failed: {_contract.Errors[index]}");

    /// <summary>The basis spectra of point <paramref name="index"/> at its redshift number <paramref name="redshift"/>.</summary>
    /// <exception cref="InvalidOperationException">The point failed.</exception>
    public BasisSpectra Spectra(int index, int redshift)
    {
        int block = Layout.Terms.Count * _k.Length;
        return new BasisSpectra(Layout, _k, Values(index).Slice(redshift * block, block).ToArray());
    }

    /// <summary>Writes the training set atomically.</summary>
    public void Save(string path) => SealedFile.Write(path, FileKind.TrainingSet, FormatVersion, Packing.Pack(_contract));

    /// <summary>The exact bytes <see cref="Save"/> writes, for comparisons.</summary>
    public byte[] ToBytes() => SealedFile.Seal(FileKind.TrainingSet, FormatVersion, Packing.Pack(_contract));

    /// <summary>Reads a training set, checking its envelope and content.</summary>
    /// <exception cref="CorruptFileException">Not a training set, truncated, corrupted, newer or inconsistent.</exception>
    public static TrainingSet Load(string path)
    {
        var contract = Packing.Unpack<TrainingSetContract>(SealedFile.Read(path, FileKind.TrainingSet, FormatVersion), path);
        GridSpec spec;
        try
        {
            spec = GridSpecReader.Parse(contract.SpecJson, path);
        }
        catch (GridSpecException e)
        {
            throw new CorruptFileException(path, $"its spec does not pass the checks of this build: {string.Join("; ", e.Problems)}");
        }

        var layout = contract.Layout.ToLayout(path);
        int n = contract.Values.Length;
        int perPoint = Runs.TrainingOutput.RedshiftsPerPoint(spec) * layout.Terms.Count * spec.K.Count;
        bool consistent = GridSpecJson.Hash(spec) == contract.SpecHash && n == spec.TotalPoints && contract.Errors.Length == n
                          && contract.Unit.Length == n * spec.Varied.Count;
        for (int i = 0; consistent && i < n; i++)
        {
            consistent = contract.Values[i] is { } v ? v.Length == perPoint && contract.Errors[i] is null : contract.Errors[i] is not null;
        }

        if (!consistent)
        {
            throw new CorruptFileException(path, "inconsistent: its sizes do not match its spec");
        }

        return new TrainingSet(contract, spec, layout);
    }

    /// <summary>Assembles a training set from merged chunks (values and errors in point order).</summary>
    internal static TrainingSet Create(Design.TrainingDesign design, string codeFingerprint, BasisLayout layout, double[]?[] values, string?[] errors)
    {
        var unit = new double[design.Count * design.Dimensions];
        for (int i = 0; i < design.Count; i++)
        {
            design.Unit(i).CopyTo(unit.AsSpan(i * design.Dimensions));
        }

        var contract = new TrainingSetContract
        {
            SpecJson = GridSpecJson.Write(design.Spec),
            SpecHash = GridSpecJson.Hash(design.Spec),
            DesignHash = design.Hash,
            CodeFingerprint = codeFingerprint,
            Unit = unit,
            Layout = BasisLayoutContract.From(layout),
            Values = values,
            Errors = errors,
        };
        return new TrainingSet(contract, design.Spec, layout);
    }
}
