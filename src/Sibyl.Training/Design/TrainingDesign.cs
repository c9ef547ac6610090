using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Design;

/// <summary>
/// The points of a training set: a maximin-improved Latin hypercube of training points and a second one,
/// drawn from an independent stream, of held-out points (indices after the training ones). Reproducible from
/// the spec's seed. Points are grouped into chunks of <see cref="GridSpec.ChunkSize"/> consecutive indices, the
/// unit of atomic writes, resumption and sharding.
/// </summary>
public sealed class TrainingDesign
{
    /// <summary>Format version written by this build.</summary>
    public const int FormatVersion = 1;

    private readonly double[] _unit;
    private readonly byte[] _file;

    private TrainingDesign(GridSpec spec, double[] unit, double criterionBefore, double criterionAfter, double minimumDistance, string hash, byte[] file)
    {
        Spec = spec;
        _unit = unit;
        _file = file;
        CriterionBefore = criterionBefore;
        CriterionAfter = criterionAfter;
        MinimumDistance = minimumDistance;
        Hash = hash;
    }

    /// <summary>The spec.</summary>
    public GridSpec Spec { get; }

    /// <summary>Number of design columns (varied parameters).</summary>
    public int Dimensions => Spec.Varied.Count;

    /// <summary>Training plus held-out points.</summary>
    public int Count => Spec.TotalPoints;

    /// <summary>φ_p (Morris &amp; Mitchell 1995) of the training design before the maximin improvement.</summary>
    public double CriterionBefore { get; }

    /// <summary>φ_p after it (lower is better spread).</summary>
    public double CriterionAfter { get; }

    /// <summary>Smallest distance between two training points in the unit cube.</summary>
    public double MinimumDistance { get; }

    /// <summary>SHA-256 of the stored design: the identity every chunk and training set refers to.</summary>
    public string Hash { get; }

    /// <summary>Number of chunks.</summary>
    public int ChunkCount => (Count + Spec.ChunkSize - 1) / Spec.ChunkSize;

    /// <summary>Unit-cube coordinates of point <paramref name="index"/>.</summary>
    public ReadOnlySpan<double> Unit(int index) => _unit.AsSpan(index * Dimensions, Dimensions);

    /// <summary>Parameter values of point <paramref name="index"/>, in <see cref="GridSpec.Varied"/> order.</summary>
    public double[] Point(int index)
    {
        var unit = Unit(index);
        var values = new double[Dimensions];
        for (int c = 0; c < values.Length; c++)
        {
            values[c] = Spec.Varied[c].FromUnit(unit[c]);
        }

        return values;
    }

    /// <summary>True for training points, false for held-out ones.</summary>
    public bool IsTraining(int index) => index < Spec.TrainingPoints;

    /// <summary>The point indices [Start, End) of chunk <paramref name="chunk"/>.</summary>
    public (int Start, int End) ChunkRange(int chunk) => (chunk * Spec.ChunkSize, Math.Min(Count, (chunk + 1) * Spec.ChunkSize));

    /// <summary>Draws the design of <paramref name="spec"/> (deterministic in its seed).</summary>
    public static TrainingDesign Create(GridSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        int d = spec.Varied.Count;
        var training = LatinHypercube.Sample(spec.TrainingPoints, d, new SeededRandom(spec.Seed));
        var (before, after) = MaximinImprovement.Improve(training, spec.TrainingPoints, d, Trials(spec.TrainingPoints, d), new SeededRandom(SeededRandom.Derive(spec.Seed, 1)));
        var unit = new double[spec.TotalPoints * d];
        training.CopyTo(unit, 0);
        if (spec.HeldOutPoints > 0)
        {
            var heldOut = LatinHypercube.Sample(spec.HeldOutPoints, d, new SeededRandom(SeededRandom.Derive(spec.Seed, 2)));
            MaximinImprovement.Improve(heldOut, spec.HeldOutPoints, d, Trials(spec.HeldOutPoints, d), new SeededRandom(SeededRandom.Derive(spec.Seed, 3)));
            heldOut.CopyTo(unit, training.Length);
        }

        var contract = new DesignContract
        {
            SpecJson = GridSpecJson.Write(spec),
            SpecHash = GridSpecJson.Hash(spec),
            Unit = unit,
            Criterion = [before, after],
            MinimumDistance = MaximinImprovement.MinimumDistance(training, spec.TrainingPoints, d),
        };
        return FromFile(SealedFile.Seal(FileKind.Design, FormatVersion, Packing.Pack(contract)), "new design");
    }

    /// <summary>Writes the design file atomically (the very bytes its <see cref="Hash"/> was taken from).</summary>
    public void Save(string path) => AtomicFile.WriteAllBytes(path, _file);

    /// <summary>Reads a design file, checking its envelope and its content.</summary>
    /// <exception cref="CorruptFileException">Not a design, truncated, corrupted, newer, or inconsistent.</exception>
    public static TrainingDesign Load(string path) => FromFile(File.ReadAllBytes(path), path);

    private static TrainingDesign FromFile(byte[] file, string source)
    {
        var payload = SealedFile.Open(file, source, FileKind.Design, FormatVersion);
        var contract = Packing.Unpack<DesignContract>(payload, source);
        GridSpec spec;
        try
        {
            spec = GridSpecReader.Parse(contract.SpecJson, source);
        }
        catch (GridSpecException e)
        {
            throw new CorruptFileException(source, $"its spec no longer passes the checks of this build: {string.Join("; ", e.Problems)}");
        }

        if (GridSpecJson.Hash(spec) != contract.SpecHash)
        {
            throw new CorruptFileException(source, "its spec does not match the spec hash stored with it");
        }

        if (contract.Unit.Length != spec.TotalPoints * spec.Varied.Count || contract.Criterion.Length != 2
            || contract.Unit.Any(u => !(u >= 0.0 && u <= 1.0)))
        {
            throw new CorruptFileException(source, $"inconsistent: expected {spec.TotalPoints} points of {spec.Varied.Count} coordinates in [0, 1]");
        }

        return new TrainingDesign(spec, contract.Unit, contract.Criterion[0], contract.Criterion[1], contract.MinimumDistance, payload.Hash, file);
    }

    /// <summary>
    /// Proposed swaps: 100 per coordinate (enough for φ_p to settle on designs of a few hundred points), capped
    /// so that the improvement of a large design stays within a few seconds.
    /// </summary>
    private static int Trials(int points, int dimensions)
    {
        long perTrial = 4L * points * dimensions;
        long cap = 4_000_000_000L / Math.Max(1, perTrial);
        return (int)Math.Min(100L * points * dimensions, Math.Min(cap, int.MaxValue));
    }
}
