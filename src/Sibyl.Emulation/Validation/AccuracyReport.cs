using System.Globalization;
using System.Text;
using MathNet.Numerics.Statistics;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Emulation.Validation;

/// <summary>
/// How far an emulator is from the direct calculation: for every basis term and k, the 50th, 90th and 99th
/// percentiles and the maximum of the error over the compared points, and the worst points by name. The error is
/// relative, |emulated − direct| / |direct|, for terms that are positive at every compared point and k; for terms
/// that change sign it is |emulated − direct| divided by the term's root-mean-square over the points at that k
/// (a relative error is meaningless where a term crosses zero). Percentiles interpolate linearly between order
/// statistics (Hyndman &amp; Fan 1996, definition 7).
/// </summary>
public sealed class AccuracyReport
{
    /// <summary>k up to which the headline numbers are quoted (DESIGN.md's accuracy target), h/Mpc.</summary>
    public const double HeadlineKMax = 0.3;

    private readonly AccuracyContract _contract;

    /// <summary>Wraps stored numbers.</summary>
    public AccuracyReport(AccuracyContract contract, IReadOnlyList<string> termNames, IReadOnlyList<double> k)
    {
        ArgumentNullException.ThrowIfNull(contract);
        ArgumentNullException.ThrowIfNull(termNames);
        ArgumentNullException.ThrowIfNull(k);
        int size = termNames.Count * k.Count;
        if (contract.P50.Length != size || contract.P90.Length != size || contract.P99.Length != size || contract.Max.Length != size
            || contract.Relative.Length != termNames.Count)
        {
            throw new ArgumentException($"accuracy numbers need {size} values per percentile and {termNames.Count} metric flags", nameof(contract));
        }

        _contract = contract;
        TermNames = termNames;
        K = k;
    }

    /// <summary>Term names.</summary>
    public IReadOnlyList<string> TermNames { get; }

    /// <summary>Wavenumbers, h/Mpc.</summary>
    public IReadOnlyList<double> K { get; }

    /// <summary>Where the points came from.</summary>
    public string Source => _contract.Source;

    /// <summary>Number of compared points.</summary>
    public int Points => _contract.Points;

    /// <summary>The stored form.</summary>
    public AccuracyContract Contract => _contract;

    /// <summary>True when term <paramref name="term"/>'s error is relative.</summary>
    public bool IsRelative(int term) => _contract.Relative[term];

    /// <summary>One percentile curve of a term over k: 50, 90, 99 or 100 (the maximum).</summary>
    public ReadOnlySpan<double> Curve(int term, int percentile) => percentile switch
    {
        50 => _contract.P50.AsSpan(term * K.Count, K.Count),
        90 => _contract.P90.AsSpan(term * K.Count, K.Count),
        99 => _contract.P99.AsSpan(term * K.Count, K.Count),
        100 => _contract.Max.AsSpan(term * K.Count, K.Count),
        _ => throw new ArgumentOutOfRangeException(nameof(percentile), percentile, "50, 90, 99 or 100"),
    };

    /// <summary>The largest 99th-percentile error of a term over k ≤ <paramref name="kMax"/>.</summary>
    public double Worst99(int term, double kMax = HeadlineKMax)
    {
        double worst = 0.0;
        var p99 = Curve(term, 99);

        // A grid k meant to be kMax but built by arithmetic can exceed it by an ulp; 1e-12 relative keeps it in.
        for (int i = 0; i < K.Count && K[i] <= kMax * (1 + 1e-12); i++)
        {
            worst = Math.Max(worst, p99[i]);
        }

        return worst;
    }

    /// <summary>Compares emulated and direct values of the same points.</summary>
    /// <exception cref="ArgumentException">No points, or sizes disagree.</exception>
    public static AccuracyReport Measure(string source, IReadOnlyList<string> termNames, IReadOnlyList<double> k, IReadOnlyList<Comparison> comparisons)
    {
        ArgumentNullException.ThrowIfNull(termNames);
        ArgumentNullException.ThrowIfNull(k);
        ArgumentNullException.ThrowIfNull(comparisons);
        int terms = termNames.Count, nk = k.Count, n = comparisons.Count, size = terms * nk;
        if (n == 0 || comparisons.Any(c => c.Emulated.Length != size || c.Direct.Length != size))
        {
            throw new ArgumentException($"need at least one comparison of {size} values each", nameof(comparisons));
        }

        var relative = new bool[terms];
        var error = new double[n, size];
        for (int t = 0; t < terms; t++)
        {
            relative[t] = comparisons.All(c => c.Direct.AsSpan(t * nk, nk).IndexOfAnyInRange(double.NegativeInfinity, 0.0) < 0);
            for (int i = 0; i < nk; i++)
            {
                int at = (t * nk) + i;
                double rms = Math.Sqrt(comparisons.Average(c => c.Direct[at] * c.Direct[at]));
                for (int p = 0; p < n; p++)
                {
                    double difference = Math.Abs(comparisons[p].Emulated[at] - comparisons[p].Direct[at]);
                    double reference = relative[t] ? Math.Abs(comparisons[p].Direct[at]) : rms;
                    error[p, at] = reference > 0.0 ? difference / reference : difference;
                }
            }
        }

        var contract = new AccuracyContract
        {
            Source = source,
            Points = n,
            P50 = new double[size],
            P90 = new double[size],
            P99 = new double[size],
            Max = new double[size],
            Relative = relative,
        };
        var column = new double[n];
        for (int at = 0; at < size; at++)
        {
            for (int p = 0; p < n; p++)
            {
                column[p] = error[p, at];
            }

            Array.Sort(column);
            contract.P50[at] = SortedArrayStatistics.QuantileCustom(column, 0.50, QuantileDefinition.R7);
            contract.P90[at] = SortedArrayStatistics.QuantileCustom(column, 0.90, QuantileDefinition.R7);
            contract.P99[at] = SortedArrayStatistics.QuantileCustom(column, 0.99, QuantileDefinition.R7);
            contract.Max[at] = column[^1];
        }

        contract.Worst = [.. Enumerable.Range(0, n)
            .Select(p => (Point: p, Worst: Enumerable.Range(0, size).MaxBy(at => error[p, at])))
            .OrderByDescending(w => error[w.Point, w.Worst])
            .Take(5)
            .Select(w => string.Create(
                CultureInfo.InvariantCulture,
                $"{comparisons[w.Point].Label}: {Format(error[w.Point, w.Worst], relative[w.Worst / nk])} on {termNames[w.Worst / nk]} at k = {k[w.Worst % nk]:G4} h/Mpc"))];
        return new AccuracyReport(contract, termNames, k);
    }

    /// <summary>The report as text: a headline per term, the per-k table, and the worst points.</summary>
    public string ToText(string title)
    {
        var text = new StringBuilder();
        text.Append(CultureInfo.InvariantCulture, $"# {title}\n# compared on {Points} {Source} points; errors relative to the direct value (or to the term's RMS at k where marked 'rms')\n");
        for (int t = 0; t < TermNames.Count; t++)
        {
            text.Append(CultureInfo.InvariantCulture, $"# {TermNames[t]}: 99th percentile at k <= {HeadlineKMax:G} h/Mpc: {Format(Worst99(t), IsRelative(t))}\n");
        }

        text.Append("term,metric,k,p50,p90,p99,max\n");
        for (int t = 0; t < TermNames.Count; t++)
        {
            for (int i = 0; i < K.Count; i++)
            {
                text.Append(CultureInfo.InvariantCulture, $"{TermNames[t]},{(IsRelative(t) ? "relative" : "rms")},{K[i]:R},{Curve(t, 50)[i]:G4},{Curve(t, 90)[i]:G4},{Curve(t, 99)[i]:G4},{Curve(t, 100)[i]:G4}\n");
            }
        }

        text.Append("# worst points:\n");
        foreach (string line in _contract.Worst)
        {
            text.Append("#   ").Append(line).Append('\n');
        }

        return text.ToString();
    }

    /// <summary>An error as a percentage, marked when it is in RMS units.</summary>
    public static string Format(double error, bool relative) =>
        string.Create(CultureInfo.InvariantCulture, $"{100.0 * error:G3}%{(relative ? "" : " of rms")}");
}
