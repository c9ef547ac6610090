using System.Globalization;
using Sibyl.Cli.Output;
using Sibyl.Plotting;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute linear</c>: P_lin and P_nw at the output redshift.</summary>
internal static class ComputeLinear
{
    public static ComputeResult Run(PointArguments point)
    {
        var model = point.Model;
        double d = model.Growth(point.Redshift).D;
        var table = new CsvTable(["k", "P_lin", "P_nw"]);
        var pLin = new double[point.K.Length];
        var pNw = new double[point.K.Length];
        for (int i = 0; i < point.K.Length; i++)
        {
            double k = point.K[i];
            pLin[i] = d * d * model.Linear.Shape.Evaluate(k);
            pNw[i] = d * d * model.Linear.NoWiggleShape.Evaluate(k);
            table.Add(k, pLin[i], pNw[i]);
        }

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel(Title(point), "P [(Mpc/h)^3]", AxisScale.Log10)
            .AddSeries("P_lin", point.K, pLin)
            .AddSeries("P_nw", point.K, pNw);
        figure.AddPanel("Baryon acoustic oscillations", "P_lin / P_nw", referenceY: 1.0)
            .AddSeries("P_lin / P_nw", point.K, pLin.Zip(pNw, (a, b) => a / b).ToArray());
        return new ComputeResult(table, Summary(point), figure);
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

    /// <summary>A figure title naming the model and redshift.</summary>
    public static string Title(PointArguments point) =>
        string.Create(CultureInfo.InvariantCulture, $"{point.Model.Gravity.Name}, z = {point.Redshift:G}");
}
