namespace Sibyl.Demo.Sampling;

/// <summary>
/// An unnormalised log probability density evaluated for many points at once, so that every proposal of an ensemble
/// half-step can go to the theory in one batch.
/// </summary>
public interface IBatchLogDensity
{
    /// <summary>Number of parameters of each point.</summary>
    int Dimension { get; }

    /// <summary>Writes ln p of every point into <paramref name="logDensity"/>; −∞ outside the support (for example the prior box).</summary>
    void Evaluate(IReadOnlyList<double[]> points, Span<double> logDensity);
}
