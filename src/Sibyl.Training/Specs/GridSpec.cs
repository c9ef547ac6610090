using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Training.Specs;

/// <summary>
/// What a training set covers: the calculation, the gravity model, the prior box, fixed values, redshifts,
/// the k grid and how many points to draw. Read from JSON by <see cref="GridSpecReader"/>, which checks
/// everything; the format is documented in training-grids/README.md.
/// </summary>
public sealed record GridSpec
{
    /// <summary>Short name, used for default file names.</summary>
    public required string Name { get; init; }

    /// <summary>Which direct calculation to run.</summary>
    public required OutputKind Output { get; init; }

    /// <summary>Gravity model name as in <see cref="ParameterCatalog.Models"/>.</summary>
    public required string Model { get; init; }

    /// <summary>Parameters spanned by the design, in design-column order.</summary>
    public required IReadOnlyList<VariedParameter> Varied { get; init; }

    /// <summary>Parameters held fixed (catalog names); the rest take the catalog defaults.</summary>
    public required IReadOnlyDictionary<string, double> Fixed { get; init; }

    /// <summary>Redshifts computed for every point when z is not varied; empty when it is.</summary>
    public required IReadOnlyList<double> Redshifts { get; init; }

    /// <summary>Output wavenumbers in h/Mpc, strictly increasing.</summary>
    public required IReadOnlyList<double> K { get; init; }

    /// <summary>Training points (a maximin Latin hypercube).</summary>
    public required int TrainingPoints { get; init; }

    /// <summary>Held-out points (a second, independent Latin hypercube).</summary>
    public required int HeldOutPoints { get; init; }

    /// <summary>Seed of both designs.</summary>
    public required ulong Seed { get; init; }

    /// <summary>Points per chunk file: the unit of atomic writes, resumption and sharding.</summary>
    public required int ChunkSize { get; init; }

    /// <summary>The user's linear-spectrum program, or null for the built-in <see cref="LinearSource"/>.</summary>
    public ExternalLinearCommand? Linear { get; init; }

    /// <summary>
    /// The built-in linear spectrum of every point when <see cref="Linear"/> is null: the Eisenstein &amp; Hu (1998)
    /// fit (default) or the Boltzmann solver. Ignored when <see cref="Linear"/> is set.
    /// </summary>
    public LinearSource LinearSource { get; init; } = LinearSource.Fit;

    /// <summary>Lower end of every point's linear table, h/Mpc: the program's k_min, else the built-in sources' range.</summary>
    public double LinearKMin => Linear?.KMin ?? LinearSpectrumFactory.DefaultKMin;

    /// <summary>Upper end of every point's linear table, h/Mpc.</summary>
    public double LinearKMax => Linear?.KMax ?? LinearSpectrumFactory.DefaultKMax;

    /// <summary>True when every point's linear spectrum comes from the Boltzmann solver.</summary>
    public bool UsesBoltzmann => Linear is null && LinearSource == LinearSource.Boltzmann;

    /// <summary>True when z is one of the varied parameters.</summary>
    public bool VariesRedshift => Varied.Any(v => v.Name == ParameterCatalog.Redshift.Name);

    /// <summary>Training plus held-out points.</summary>
    public int TotalPoints => TrainingPoints + HeldOutPoints;
}
