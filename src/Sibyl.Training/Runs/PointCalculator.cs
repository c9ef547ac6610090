using Sibyl.Cosmology;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.Spectra;
using Sibyl.Perturbation.TimeDependence;
using Sibyl.Training.Design;
using Sibyl.Training.Linear;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Runs;

/// <summary>
/// The direct calculation of one point of a spec's box (a design point or any other): every basis term over the spec's k grid at each of the point's
/// redshifts, as one array (redshift-major, then term-major, then k). The quadrature plans depend only on the
/// k grid and the linear table range, so they are built once and shared by all threads (they keep no state
/// between calls); the loop integrals of a point's linear spectrum are computed once and reused for each redshift.
/// </summary>
public sealed class PointCalculator
{
    private readonly TrainingDesign? _design;
    private readonly GridSpec _spec;
    private readonly OneLoopMatter? _matter;
    private readonly OneLoopGalaxy? _galaxy;
    private readonly ExternalLinearProvider? _provider;

    /// <summary>Builds the plans for <paramref name="design"/>'s k grid; points are then computed by index.</summary>
    /// <exception cref="ArgumentException">The spec's k grid does not fit its linear table range.</exception>
    public PointCalculator(TrainingDesign design)
        : this((design ?? throw new ArgumentNullException(nameof(design))).Spec)
    {
        _design = design;
    }

    /// <summary>
    /// Builds the plans for <paramref name="spec"/>'s k grid, for points of its box given by their coordinates
    /// (<see cref="Compute(ReadOnlySpan{double}, int, CancellationToken)"/>) rather than a design's index.
    /// </summary>
    /// <exception cref="ArgumentException">The spec's k grid does not fit its linear table range.</exception>
    public PointCalculator(GridSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        _spec = spec;
        var k = spec.K.ToArray();
        double qMin = spec.LinearKMin, qMax = spec.LinearKMax;
        if (spec.Output == OutputKind.Matter)
        {
            _matter = new OneLoopMatter(k, qMin, qMax);
        }
        else
        {
            _galaxy = new OneLoopGalaxy(k, OneLoopGalaxy.DefaultMuNodes, qMin, qMax);
        }

        _provider = spec.Linear is { } command ? new ExternalLinearProvider(command) : null;
        Layout = TrainingOutput.Layout(spec);
        ValuesPerPoint = TrainingOutput.ValuesPerPoint(spec);
    }

    /// <summary>The basis layout of every point's spectra.</summary>
    public BasisLayout Layout { get; }

    /// <summary>Numbers per point: redshifts × terms × k values.</summary>
    public int ValuesPerPoint { get; }

    /// <summary>
    /// True when <paramref name="exception"/>, thrown by <see cref="Compute(int, CancellationToken)"/>, means that this
    /// point failed (parameters the physics refuses, a non-finite result, the user's linear program failing) and its
    /// message is meant for the user; anything else is a fault of the program or the machine.
    /// </summary>
    public static bool IsPointFailure(Exception exception) =>
        exception is ArgumentException or ArithmeticException or InvalidOperationException or ExternalLinearException;

    /// <summary>Computes point <paramref name="index"/> of the design.</summary>
    /// <exception cref="InvalidOperationException">This calculator was built from a spec, without a design.</exception>
    /// <exception cref="Exception">Anything the calculation or the user's linear program throws; the run records it.</exception>
    public double[] Compute(int index, CancellationToken cancellation)
    {
        var design = _design ?? throw new InvalidOperationException("this calculator was built from a spec alone; give the point's coordinates");
        return Compute(design.Point(index), index, cancellation);
    }

    /// <summary>
    /// Computes the point of the spec's box at <paramref name="varied"/> (values of the varied parameters in the
    /// spec's order, in their own units) exactly as a training run computes a design point: the spec's linear source
    /// (built-in or the user's program) and table range, and every redshift of the point.
    /// </summary>
    /// <param name="varied">Coordinates of the point, one per varied parameter.</param>
    /// <param name="pointIndex">The number sent to a user's linear program as "point": the design index for a design
    /// point, otherwise any label that helps the program's own logs.</param>
    /// <param name="cancellation">Stops a user's linear program.</param>
    /// <returns>Redshift-major, then term-major, then k values, <see cref="ValuesPerPoint"/> numbers.</returns>
    /// <exception cref="Exception">Anything the calculation or the user's linear program throws (see <see cref="IsPointFailure"/>).</exception>
    public double[] Compute(ReadOnlySpan<double> varied, int pointIndex, CancellationToken cancellation)
    {
        var spec = _spec;
        if (varied.Length != spec.Varied.Count)
        {
            throw new ArgumentException($"the spec varies {spec.Varied.Count} parameters, not {varied.Length}", nameof(varied));
        }

        var parameters = GridPoint.Cosmology(spec, varied);
        CosmologyModel model;
        if (_provider is null)
        {
            // One solver thread: the run is already parallel over points.
            model = CosmologyModel.Create(parameters, spec.LinearSource, threads: 1);
        }
        else
        {
            var (k, p) = _provider.Fetch(parameters, pointIndex, cancellation);
            model = CosmologyModel.CreateFromTable(parameters, k, p, spec.Linear!.KMin, spec.Linear.KMax);
        }

        var redshifts = GridPoint.Redshifts(spec, varied);
        var values = new double[ValuesPerPoint];
        int block = Layout.Terms.Count * spec.K.Count;
        if (_matter is not null)
        {
            var shape = _matter.Prepare(model.Linear);
            for (int r = 0; r < redshifts.Length; r++)
            {
                Copy(_matter.Compute(shape, model, redshifts[r]).Basis, values.AsSpan(r * block, block));
            }
        }
        else
        {
            var shape = _galaxy!.Prepare(model.Linear);
            for (int r = 0; r < redshifts.Length; r++)
            {
                var time = TimeCoefficientSolver.Solve(model.Background, model.Gravity, 1.0 / (1.0 + redshifts[r]));
                Copy(_galaxy.Evaluate(shape, time).Basis, values.AsSpan(r * block, block));
            }
        }

        foreach (double v in values)
        {
            if (!double.IsFinite(v))
            {
                throw new ArithmeticException("the calculation produced a non-finite value");
            }
        }

        return values;
    }

    private static void Copy(BasisSpectra basis, Span<double> destination)
    {
        int n = basis.K.Length;
        for (int t = 0; t < basis.Layout.Terms.Count; t++)
        {
            basis.Term(t).CopyTo(destination.Slice(t * n, n));
        }
    }
}
