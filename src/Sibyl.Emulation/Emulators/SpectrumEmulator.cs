using System.Globalization;
using Sibyl.Cosmology.Parameters;
using Sibyl.Emulation.Compression;
using Sibyl.Emulation.Gaussian;
using Sibyl.Emulation.Validation;
using Sibyl.Perturbation.Spectra;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Emulation.Emulators;

/// <summary>
/// A fitted emulator of every basis term of one output over a parameter box: per basis term and redshift, a
/// transform (<see cref="TargetTransform"/>), principal components, and Gaussian processes (with a polynomial trend)
/// for their coefficients. Immutable and shared between threads; predictions go through
/// <see cref="CreatePredictor"/>, one predictor per thread. It knows its box and refuses to extrapolate unless told,
/// and carries the accuracy measured on held-out points when it was fitted.
/// </summary>
public sealed class SpectrumEmulator
{
    /// <summary>Format version written by this build.</summary>
    public const int FormatVersion = 1;

    private readonly EmulatorContract _contract;

    internal SpectrumEmulator(EmulatorContract contract, string source)
    {
        _contract = contract;
        try
        {
            Spec = GridSpecReader.Parse(contract.SpecJson, source);
        }
        catch (GridSpecException e)
        {
            throw new CorruptFileException(source, $"its spec does not pass the checks of this build: {string.Join("; ", e.Problems)}");
        }

        Layout = contract.Layout.ToLayout(source);
        int d = contract.ParameterNames.Length, nk = contract.K.Length, terms = Layout.Terms.Count;
        SliceCount = Math.Max(1, contract.Redshifts.Length);
        if (d == 0 || contract.Min.Length != d || contract.Max.Length != d || contract.InputWarps.Length != d || nk == 0 || terms == 0
            || contract.Blocks.Length != SliceCount * terms || contract.TrainingInputs.Length % d != 0)
        {
            throw new CorruptFileException(source, "inconsistent: its sizes do not agree");
        }

        Blocks = [.. contract.Blocks.Select(b => PrincipalComponents.FromArrays(b.Mean, b.Scale, b.Basis, b.SingularValues, b.MaximumError, b.RmsError, b.ExplainedFraction))];
        Transforms = [.. contract.Blocks.Select(b => Enum.IsDefined((TargetTransform)b.Transform) ? (TargetTransform)b.Transform : throw new CorruptFileException(source, "unknown transform"))];
        if (Blocks.Any(b => b.FeatureCount != nk))
        {
            throw new CorruptFileException(source, "inconsistent: a block's length differs from the k grid");
        }

        Processes = [.. contract.Processes.Select(p => GaussianProcessModel.FromArrays(
            (KernelKind)p.Kernel,
            new GaussianProcessHyperparameters(p.SignalVariance, p.LengthScales, p.NoiseVariance),
            contract.TrainingInputs,
            p.Alpha,
            p.OutputMean,
            p.OutputScale,
            p.Cholesky,
            p.LogMarginalLikelihood))];
        HasVariance = Processes.All(p => p.HasCholeskyFactor);
        Trends = [.. contract.Processes.Select(p => new QuadraticTrend(p.TrendDegree, d, p.OutputMean.Length, p.TrendCoefficients))];
        var covered = new bool[Blocks.Sum(b => b.Count)];
        int[] offsets = [.. Blocks.Select((b, i) => Blocks.Take(i).Sum(x => x.Count))];
        foreach (var p in contract.Processes)
        {
            if (p.OutputBlocks.Length != p.OutputMean.Length || p.OutputComponents.Length != p.OutputMean.Length)
            {
                throw new CorruptFileException(source, "inconsistent: a process's outputs are not mapped");
            }

            for (int j = 0; j < p.OutputBlocks.Length; j++)
            {
                int b = p.OutputBlocks[j], c = p.OutputComponents[j];
                if (b < 0 || b >= Blocks.Length || c < 0 || c >= Blocks[b].Count || covered[offsets[b] + c]
                    || p.OutputBlocks[0] / terms != b / terms)
                {
                    throw new CorruptFileException(source, "inconsistent: a process maps to a component that does not exist, twice, or across slices");
                }

                covered[offsets[b] + c] = true;
            }
        }

        if (covered.Any(c => !c))
        {
            throw new CorruptFileException(source, "inconsistent: a principal component has no Gaussian process");
        }

        Accuracy = new AccuracyReport(contract.Accuracy, [.. Layout.Terms.Select(t => t.Name)], contract.K);
        Warps = [.. contract.InputWarps.Select(w => Enum.IsDefined((InputWarp)w) ? (InputWarp)w : throw new CorruptFileException(source, "unknown input warp"))];
    }

    /// <summary>The grid spec of the training set.</summary>
    public GridSpec Spec { get; }

    /// <summary>Input parameter names, in order.</summary>
    public IReadOnlyList<string> ParameterNames => _contract.ParameterNames;

    /// <summary>Lower edges of the box.</summary>
    public IReadOnlyList<double> Min => _contract.Min;

    /// <summary>Upper edges of the box.</summary>
    public IReadOnlyList<double> Max => _contract.Max;

    /// <summary>Wavenumbers in h/Mpc.</summary>
    public IReadOnlyList<double> K => _contract.K;

    /// <summary>Redshift of each slice; empty when z is one of the inputs.</summary>
    public IReadOnlyList<double> Redshifts => _contract.Redshifts;

    /// <summary>Number of redshift slices (1 when z is an input).</summary>
    public int SliceCount { get; }

    /// <summary>Basis layout of the predicted spectra.</summary>
    public BasisLayout Layout { get; }

    /// <summary>Accuracy measured on the held-out points at fit time.</summary>
    public AccuracyReport Accuracy { get; private set; }

    /// <summary>Hash of the design of the training set.</summary>
    public string DesignHash => _contract.DesignHash;

    /// <summary>Fingerprint of the build that computed the training set.</summary>
    public string CodeFingerprint => _contract.CodeFingerprint;

    /// <summary>Number of training points.</summary>
    public int TrainingCount => _contract.TrainingInputs.Length / ParameterNames.Count;

    /// <summary>True when predictive variances are available.</summary>
    public bool HasVariance { get; }

    internal PrincipalComponents[] Blocks { get; }

    internal TargetTransform[] Transforms { get; }

    internal InputWarp[] Warps { get; }

    internal GaussianProcessModel[] Processes { get; }

    internal QuadraticTrend[] Trends { get; }

    internal EmulatorContract Contract => _contract;

    /// <summary>The warp the fitter chooses for a parameter: √u for Ω_rc on a box from 0 (see <see cref="InputWarp.SquareRoot"/>).</summary>
    public static InputWarp WarpFor(string name, double min) =>
        name == ParameterCatalog.OmegaRc.Name && min == 0.0 ? InputWarp.SquareRoot : InputWarp.Identity;

    /// <summary>The process input of unit-box coordinate <paramref name="u"/> under <paramref name="warp"/>, and its derivative.</summary>
    public static (double Value, double Derivative) Warp(InputWarp warp, double u)
    {
        if (warp == InputWarp.Identity)
        {
            return (u, 1.0);
        }

        // Below 0 (mild extrapolation) the square root is continued as the odd function; the derivative is capped at
        // u = 1e-12 (where it is 5e5 per unit of u) rather than infinite at the edge.
        double root = Math.Sqrt(Math.Max(Math.Abs(u), 1e-12));
        return (Math.CopySign(Math.Sqrt(Math.Abs(u)), u), 0.5 / root);
    }

    /// <summary>
    /// Replaces the placeholder accuracy with <paramref name="accuracy"/>, in memory and in the stored form. In place
    /// because the fitter can only measure accuracy on the emulator itself, and a copy would either rebuild every
    /// fitted part (the Cholesky factors alone are n² numbers per process) or repeat this constructor field by field.
    /// For the fitter only, before the emulator is handed out, so that it is immutable to everyone else.
    /// </summary>
    internal void RecordAccuracy(AccuracyReport accuracy)
    {
        _contract.Accuracy = accuracy.Contract;
        Accuracy = accuracy;
    }

    /// <summary>A predictor with its own buffers; make one per thread.</summary>
    public EmulatorPredictor CreatePredictor() => new(this);

    /// <summary>The slice holding redshift <paramref name="z"/> (exact match), for emulators trained at fixed redshifts.</summary>
    /// <exception cref="ParameterOutOfRangeException">z is not one of the trained redshifts.</exception>
    public int SliceOf(double z)
    {
        // z reaches here as a double a client may have computed (0.1 + 0.2 misses 0.3 by 6e-17): 1e-9 absorbs such
        // round-off yet is far below any useful spacing of trained redshifts; absolute below z = 1 so that z = 0 matches.
        for (int s = 0; s < _contract.Redshifts.Length; s++)
        {
            if (Math.Abs(_contract.Redshifts[s] - z) <= 1e-9 * Math.Max(1.0, z))
            {
                return s;
            }
        }

        throw new ParameterOutOfRangeException(
            ParameterCatalog.Redshift.Name,
            $"this emulator was trained at z = {string.Join(", ", _contract.Redshifts.Select(r => r.ToString("G", CultureInfo.InvariantCulture)))} only");
    }

    /// <summary>
    /// Checks a parameter vector at the edge: right length, finite, inside the box; returns false when it is
    /// outside but <paramref name="allowExtrapolation"/> lets it through.
    /// </summary>
    /// <exception cref="ParameterOutOfRangeException">Not finite, or outside the box without permission; names the parameter and its range.</exception>
    /// <exception cref="ArgumentException">Wrong number of values.</exception>
    public bool CheckInBox(ReadOnlySpan<double> parameters, bool allowExtrapolation)
    {
        if (parameters.Length != ParameterNames.Count)
        {
            throw new ArgumentException($"expected {ParameterNames.Count} parameters ({string.Join(", ", ParameterNames)}), got {parameters.Length}", nameof(parameters));
        }

        bool inside = true;
        for (int q = 0; q < parameters.Length; q++)
        {
            double v = parameters[q];
            if (!double.IsFinite(v))
            {
                throw new ParameterOutOfRangeException(ParameterNames[q], $"must be finite, got {v.ToString(CultureInfo.InvariantCulture)}");
            }

            if (v < Min[q] || v > Max[q])
            {
                if (!allowExtrapolation)
                {
                    throw new ParameterOutOfRangeException(
                        ParameterNames[q],
                        string.Create(CultureInfo.InvariantCulture, $"{v:G} is outside the emulator's box [{Min[q]:G}, {Max[q]:G}]; the emulator is valid only inside it"));
                }

                inside = false;
            }
        }

        return inside;
    }

    /// <summary>Writes the emulator atomically.</summary>
    public void Save(string path) => SealedFile.Write(path, FileKind.Emulator, FormatVersion, Packing.Pack(_contract));

    /// <summary>The exact bytes <see cref="Save"/> writes.</summary>
    public byte[] ToBytes() => SealedFile.Seal(FileKind.Emulator, FormatVersion, Packing.Pack(_contract));

    /// <summary>Reads an emulator file with MessagePack's untrusted-data settings, checking envelope and content.</summary>
    /// <exception cref="CorruptFileException">Not an emulator, truncated, corrupted, newer, or inconsistent.</exception>
    public static SpectrumEmulator Load(string path) => FromBytes(File.ReadAllBytes(path), path);

    /// <summary>Reads emulator bytes; <paramref name="source"/> names them in messages.</summary>
    /// <exception cref="CorruptFileException">Not an emulator, truncated, corrupted, newer, or inconsistent.</exception>
    public static SpectrumEmulator FromBytes(byte[] bytes, string source)
    {
        var contract = Packing.Unpack<EmulatorContract>(SealedFile.Open(bytes, source, FileKind.Emulator, FormatVersion), source);
        try
        {
            return new SpectrumEmulator(contract, source);
        }
        catch (ArgumentException e)
        {
            throw new CorruptFileException(source, $"inconsistent: {e.Message}");
        }
    }
}
