using System.Globalization;
using System.Text;
using Sibyl.Emulation.Validation;
using Sibyl.Plotting;
using Sibyl.Training.Storage;

namespace Sibyl.Cli.Output;

/// <summary>Writes an accuracy report as text (PREFIX.txt) and as a figure of the error percentiles over k (PREFIX.png).</summary>
internal static class AccuracyOutput
{
    // A log axis cannot show an exact zero; errors below this are invisible at any useful scale anyway.
    private const double SmallestShown = 1e-9;

    // A galaxy emulator has dozens of terms; a figure of them all would be unreadable (and too tall to draw).
    private const int MaxPanels = 8;

    public static void Write(AccuracyReport report, string title, string prefix, TextWriter stderr)
    {
        AtomicFile.WriteAllBytes(prefix + ".txt", Encoding.UTF8.GetBytes(report.ToText(title)));
        var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
        var shown = Enumerable.Range(0, report.TermNames.Count).OrderByDescending(t => report.Worst99(t)).Take(MaxPanels).Order().ToList();
        foreach (int t in shown)
        {
            string metric = report.IsRelative(t) ? "|emulated/direct - 1|" : "|emulated - direct| / rms";
            string of = shown.Count < report.TermNames.Count ? $"; {MaxPanels} worst of {report.TermNames.Count} terms, all in the .txt" : "";
            var panel = figure.AddPanel($"{report.TermNames[t]} ({report.Points} {report.Source} points{of})", metric, AxisScale.Log10);
            foreach (int percentile in new[] { 50, 90, 99, 100 })
            {
                var curve = report.Curve(t, percentile).ToArray().Select(v => Math.Max(v, SmallestShown)).ToArray();
                panel.AddSeries(percentile == 100 ? "max" : $"{percentile}th percentile", report.K, curve);
            }

            panel.AddSeries("0.1% target", [report.K[0], report.K[^1]], [1e-3, 1e-3]);
        }

        figure.Save(prefix + ".png", heightPerPanel: 300);
        stderr.WriteLine($"report: {prefix}.txt and {prefix}.png");
    }

    /// <summary>One line per term: its 99th-percentile error at k ≤ 0.3 h/Mpc.</summary>
    public static void Summarize(AccuracyReport report, string command, TextWriter stderr)
    {
        for (int t = 0; t < report.TermNames.Count; t++)
        {
            stderr.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"{command}: {report.TermNames[t]}: 99th percentile error at k <= {AccuracyReport.HeadlineKMax:G} h/Mpc over {report.Points} {report.Source} points: {AccuracyReport.Format(report.Worst99(t), report.IsRelative(t))}"));
        }
    }
}
