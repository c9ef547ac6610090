using System.Globalization;
using Sibyl.Cli.Output;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Plotting;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute galaxy</c>: one-loop redshift-space galaxy multipoles P0, P2, P4.</summary>
internal static class ComputeGalaxy
{
    public static ComputeResult Run(PointArguments point, double[] nuisance, bool basis)
    {
        point.RequireLoopRange();
        var linear = point.Model.Linear;
        var spectrum = new OneLoopGalaxy(point.K, qMin: linear.KMin, qMax: linear.KMax).Compute(point.Model, point.Redshift);
        var p0 = spectrum.Multipole(0, nuisance);
        var p2 = spectrum.Multipole(2, nuisance);
        var p4 = spectrum.Multipole(4, nuisance);
        var terms = GalaxyLayout.Layout.Terms;
        var columns = new List<string> { "k", "P0", "P2", "P4" };
        if (basis)
        {
            columns.AddRange(terms.Select(t => t.Name));
        }

        var table = new CsvTable(columns);
        for (int i = 0; i < point.K.Length; i++)
        {
            var row = new List<double> { point.K[i], p0[i], p2[i], p4[i] };
            if (basis)
            {
                for (int t = 0; t < terms.Count; t++)
                {
                    row.Add(spectrum.Basis.Term(t)[i]);
                }
            }

            table.Add([.. row]);
        }

        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        figure.AddPanel($"Galaxy multipoles, {ComputeLinear.Title(point)}", "k P_ell [(Mpc/h)^2]")
            .AddSeries("k P0", point.K, Times(point.K, p0))
            .AddSeries("k P2", point.K, Times(point.K, p2))
            .AddSeries("k P4", point.K, Times(point.K, p4));
        string values = string.Join(' ', GalaxyLayout.Nuisance.Select((d, i) => string.Create(CultureInfo.InvariantCulture, $"{d.Name}={nuisance[i]:G}")));
        string summary = string.Create(CultureInfo.InvariantCulture, $"{ComputeLinear.Summary(point)} Sigma={Math.Sqrt(spectrum.Sigma2):G6} Mpc/h {values}");
        return new ComputeResult(table, summary, figure);
    }

    private static double[] Times(double[] k, double[] p) => k.Zip(p, (a, b) => a * b).ToArray();
}
