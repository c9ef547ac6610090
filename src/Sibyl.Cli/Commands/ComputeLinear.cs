using System.Globalization;
using Sibyl.Cli.Output;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Plotting;

namespace Sibyl.Cli.Commands;

/// <summary>
/// <c>sibyl compute linear</c>: P_lin and P_nw at the output redshift; with <c>linear=boltzmann</c> also the fit's,
/// so that the solver can be judged against it.
/// </summary>
internal static class ComputeLinear
{
    public static ComputeResult Run(PointArguments point)
    {
        if (point.Source == LinearSource.Boltzmann)
        {
            return AgainstFit(point);
        }

        var (pLin, pNw) = Spectra(point.Model, point);
        var table = new CsvTable(["k", "P_lin", "P_nw"]);
        for (int i = 0; i < point.K.Length; i++)
        {
            table.Add(point.K[i], pLin[i], pNw[i]);
        }

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel(Title(point), "P [(Mpc/h)^3]", AxisScale.Log10)
            .AddSeries("P_lin", point.K, pLin)
            .AddSeries("P_nw", point.K, pNw);
        figure.AddPanel("Baryon acoustic oscillations", "P_lin / P_nw", referenceY: 1.0)
            .AddSeries("P_lin / P_nw", point.K, Ratio(pLin, pNw));
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

    /// <summary>
    /// The solver's spectrum beside the fit's for the same cosmology. Both share the background and so the growth;
    /// only the shapes differ, and their ratio shows where (BAO phase, turnover, small scales).
    /// </summary>
    private static ComputeResult AgainstFit(PointArguments point)
    {
        var fitModel = CosmologyModel.Create(point.Model.Parameters, LinearSource.Fit);
        var (pLin, pNw) = Spectra(point.Model, point);
        var (fitLin, fitNw) = Spectra(fitModel, point);
        var ratio = Ratio(pLin, fitLin);
        var table = new CsvTable(["k", "P_lin", "P_nw", "P_lin_fit", "P_nw_fit", "P_lin_over_P_lin_fit"]);
        for (int i = 0; i < point.K.Length; i++)
        {
            table.Add(point.K[i], pLin[i], pNw[i], fitLin[i], fitNw[i], ratio[i]);
        }

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel($"Boltzmann solver and Eisenstein & Hu fit, {Title(point)}", "P_lin [(Mpc/h)^3]", AxisScale.Log10)
            .AddSeries("P_lin, solver", point.K, pLin)
            .AddSeries("P_lin, fit", point.K, fitLin);
        figure.AddPanel("Solver over fit", "P_solver / P_fit", referenceY: 1.0)
            .AddSeries("P_lin, solver / fit", point.K, ratio);
        figure.AddPanel("Baryon acoustic oscillations", "P_lin / P_nw", referenceY: 1.0)
            .AddSeries("solver", point.K, Ratio(pLin, pNw))
            .AddSeries("fit", point.K, Ratio(fitLin, fitNw));
        string summary = string.Create(
            CultureInfo.InvariantCulture,
            $"{Summary(point)}; fit: sigma8(z)={fitModel.Sigma8(point.Redshift):G6} r_drag={fitModel.Linear.BaoScale:G6} Mpc/h");
        return new ComputeResult(table, summary, figure);
    }

    /// <summary>P_lin and P_nw of <paramref name="model"/> at the point's redshift and k, (Mpc/h)³.</summary>
    private static (double[] Linear, double[] NoWiggle) Spectra(CosmologyModel model, PointArguments point)
    {
        double d = model.Growth(point.Redshift).D;
        var linear = new double[point.K.Length];
        var noWiggle = new double[point.K.Length];
        for (int i = 0; i < point.K.Length; i++)
        {
            linear[i] = d * d * model.Linear.Shape.Evaluate(point.K[i]);
            noWiggle[i] = d * d * model.Linear.NoWiggleShape.Evaluate(point.K[i]);
        }

        return (linear, noWiggle);
    }

    private static double[] Ratio(double[] a, double[] b) => a.Zip(b, (x, y) => x / y).ToArray();
}
