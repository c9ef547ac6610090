using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.Spectra;
using Sibyl.Training.Specs;

namespace Sibyl.Training.Runs;

/// <summary>The shape of what a spec's points produce: the basis layout and the numbers per point.</summary>
public static class TrainingOutput
{
    /// <summary>The basis layout of the spec's output.</summary>
    public static BasisLayout Layout(GridSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        return spec.Output == OutputKind.Matter ? MatterLayout.Layout : GalaxyLayout.Layout;
    }

    /// <summary>Redshifts per point: 1 when z is varied, else the length of the spec's list.</summary>
    public static int RedshiftsPerPoint(GridSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        return spec.VariesRedshift ? 1 : spec.Redshifts.Count;
    }

    /// <summary>Numbers per point: redshifts × terms × k values (redshift-major, then term-major).</summary>
    public static int ValuesPerPoint(GridSpec spec) => RedshiftsPerPoint(spec) * Layout(spec).Terms.Count * spec.K.Count;
}
