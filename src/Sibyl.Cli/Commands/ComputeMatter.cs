using System.Globalization;
using Sibyl.Cli.Output;
using Sibyl.Perturbation.Matter;
using Sibyl.Plotting;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute matter</c>: the one-loop IR-resummed real-space matter spectrum.</summary>
internal static class ComputeMatter
{
    public static ComputeResult Run(PointArguments point, double cs2)
    {
        point.RequireLoopRange();
        var linear = point.Model.Linear;
        var spectrum = new OneLoopMatter(point.K, linear.KMin, linear.KMax).Compute(point.Model, point.Redshift);
        var total = spectrum.Total(cs2);
        var counterterm = spectrum.Basis.Term(MatterLayout.Counterterm);
        var table = new CsvTable(["k", "P_lin", "P_tree_ir", "P_22", "P_13", "P_ct_basis", "P_total"]);
        for (int i = 0; i < point.K.Length; i++)
        {
            table.Add(point.K[i], spectrum.Linear[i], spectrum.TreeIr[i], spectrum.P22[i], spectrum.P13[i], counterterm[i], total[i]);
        }

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel(string.Create(CultureInfo.InvariantCulture, $"One-loop matter, {ComputeLinear.Title(point)}, cs2 = {cs2:G}"), "P / P_nw", referenceY: 1.0)
            .AddSeries("P_total / P_nw", point.K, Ratio(total, spectrum.NoWiggle))
            .AddSeries("P_lin / P_nw", point.K, Ratio(spectrum.Linear, spectrum.NoWiggle));
        figure.AddPanel("Loop terms", "|P| [(Mpc/h)^3]", AxisScale.Log10)
            .AddSeries("|P_22|", point.K, spectrum.P22.Select(Math.Abs).ToArray())
            .AddSeries("|P_13|", point.K, spectrum.P13.Select(Math.Abs).ToArray())
            .AddSeries("P_lin", point.K, spectrum.Linear);
        string summary = string.Create(CultureInfo.InvariantCulture, $"{ComputeLinear.Summary(point)} Sigma={Math.Sqrt(spectrum.Sigma2):G6} Mpc/h cs2={cs2:G}");
        return new ComputeResult(table, summary, figure);
    }

    private static double[] Ratio(double[] a, double[] b) => a.Zip(b, (x, y) => x / y).ToArray();
}
