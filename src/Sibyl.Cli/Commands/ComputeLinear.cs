using System.Globalization;
using Sibyl.Cli.Output;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute linear</c>: P_lin and P_nw at the output redshift.</summary>
internal static class ComputeLinear
{
    public static CsvTable Table(PointArguments point)
    {
        var model = point.Model;
        double d = model.Growth(point.Redshift).D;
        var table = new CsvTable(["k", "P_lin", "P_nw"]);
        foreach (double k in point.K)
        {
            table.Add(k, d * d * model.Linear.Shape.Evaluate(k), d * d * model.Linear.NoWiggleShape.Evaluate(k));
        }

        return table;
    }

    /// <summary>The growth summary printed with every output.</summary>
    public static string Summary(PointArguments point)
    {
        var model = point.Model;
        var growth = model.Growth(point.Redshift);
        return string.Create(
            CultureInfo.InvariantCulture,
            $"model={model.Gravity.Name} z={point.Redshift:G} D={growth.D:G8} f={growth.F:G8} D/D_lcdm(z=0)={growth.D / model.LcdmGrowthToday:G8} sigma8(z)={model.Sigma8(point.Redshift):G6} r_drag={model.Linear.BaoScale:G6} Mpc/h linear={model.Linear.Source}");
    }
}
