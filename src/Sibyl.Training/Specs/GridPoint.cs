using System.Globalization;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Training.Specs;

/// <summary>
/// Turns one point of a spec's box (values of the varied parameters, in design-column order) into the
/// cosmology and redshifts to compute, through the same catalog that checks the command line, so a grid
/// point and a <c>sibyl compute</c> call with the same values are the same calculation.
/// </summary>
public static class GridPoint
{
    /// <summary>The name=value pairs of a point: fixed values, then varied ones, then the model (z left out).</summary>
    public static Dictionary<string, string> Values(GridSpec spec, ReadOnlySpan<double> varied)
    {
        ArgumentNullException.ThrowIfNull(spec);
        var values = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (name, value) in spec.Fixed)
        {
            values[name] = value.ToString("R", CultureInfo.InvariantCulture);
        }

        for (int c = 0; c < spec.Varied.Count; c++)
        {
            if (spec.Varied[c].Name != ParameterCatalog.Redshift.Name)
            {
                values[spec.Varied[c].Name] = varied[c].ToString("R", CultureInfo.InvariantCulture);
            }
        }

        values[ParameterCatalog.ModelName] = spec.Model;
        return values;
    }

    /// <summary>The cosmology of a point.</summary>
    /// <exception cref="ParameterOutOfRangeException">The point is not a valid cosmology.</exception>
    public static CosmologyParameters Cosmology(GridSpec spec, ReadOnlySpan<double> varied) => ParameterCatalog.Build(Values(spec, varied));

    /// <summary>The redshifts to compute at a point: its own z when z is varied, else the spec's list.</summary>
    public static double[] Redshifts(GridSpec spec, ReadOnlySpan<double> varied)
    {
        ArgumentNullException.ThrowIfNull(spec);
        for (int c = 0; c < spec.Varied.Count; c++)
        {
            if (spec.Varied[c].Name == ParameterCatalog.Redshift.Name)
            {
                return [varied[c]];
            }
        }

        return [.. spec.Redshifts];
    }
}
