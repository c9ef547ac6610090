namespace Sibyl.Demo.Sampling;

/// <summary>Mean, standard deviation and the 16th, 50th and 84th percentiles of one parameter's samples (68 % interval).</summary>
/// <param name="Mean">Sample mean.</param>
/// <param name="StandardDeviation">Sample standard deviation.</param>
/// <param name="Lower">16th percentile.</param>
/// <param name="Median">50th percentile.</param>
/// <param name="Upper">84th percentile.</param>
public sealed record PosteriorSummary(double Mean, double StandardDeviation, double Lower, double Median, double Upper)
{
    /// <summary>Summarises <paramref name="samples"/> (at least two).</summary>
    public static PosteriorSummary Of(IReadOnlyList<double> samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        ArgumentOutOfRangeException.ThrowIfLessThan(samples.Count, 2);
        double mean = samples.Average();
        double variance = samples.Sum(v => (v - mean) * (v - mean)) / (samples.Count - 1);
        double[] sorted = [.. samples.Order()];
        return new PosteriorSummary(mean, Math.Sqrt(variance), Percentile(sorted, 0.15865), Percentile(sorted, 0.5), Percentile(sorted, 0.84135));
    }

    /// <summary>Linear interpolation between order statistics (the p(n − 1) rule) of a sorted sample.</summary>
    public static double Percentile(IReadOnlyList<double> sorted, double p)
    {
        ArgumentNullException.ThrowIfNull(sorted);
        double position = p * (sorted.Count - 1);
        int below = (int)Math.Floor(position);
        int above = Math.Min(below + 1, sorted.Count - 1);
        return sorted[below] + ((position - below) * (sorted[above] - sorted[below]));
    }
}
