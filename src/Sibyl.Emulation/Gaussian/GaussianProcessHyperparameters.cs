using System.Globalization;

namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Signal variance σ_f², one length scale ℓ_q per input dimension and noise variance (nugget) σ_n² of a Gaussian
/// process whose outputs are standardized (zero mean, unit variance) and whose inputs lie in the unit box.
/// </summary>
/// <remarks>
/// The optimiser works on the log parameters θ = (ln σ_f², ln ℓ_1, …, ln ℓ_d, ln σ_n²), in that order
/// (<see cref="ToLogParameters"/>, <see cref="FromLogParameters"/>). Immutable.
/// </remarks>
public sealed class GaussianProcessHyperparameters
{
    private readonly double[] _lengthScales;

    /// <summary>Creates a set of hyperparameters.</summary>
    /// <param name="signalVariance">σ_f², in standardized output units squared; finite and positive.</param>
    /// <param name="lengthScales">ℓ_q in unit-box input units, one per input dimension (at least one); finite and positive. Copied.</param>
    /// <param name="noiseVariance">σ_n², in standardized output units squared; finite and positive.</param>
    /// <exception cref="ArgumentNullException"><paramref name="lengthScales"/> is null.</exception>
    /// <exception cref="ArgumentException">A value is not finite and positive, or there are no length scales.</exception>
    public GaussianProcessHyperparameters(double signalVariance, IReadOnlyList<double> lengthScales, double noiseVariance)
    {
        ArgumentNullException.ThrowIfNull(lengthScales);
        Arguments.RequirePositive([signalVariance], nameof(signalVariance));
        Arguments.RequirePositive([noiseVariance], nameof(noiseVariance));
        if (lengthScales.Count == 0)
        {
            throw new ArgumentException("At least one length scale is needed.", nameof(lengthScales));
        }

        _lengthScales = [.. lengthScales];
        Arguments.RequirePositive(_lengthScales, nameof(lengthScales));
        SignalVariance = signalVariance;
        NoiseVariance = noiseVariance;
    }

    /// <summary>σ_f², the prior variance of the latent function, in standardized output units squared.</summary>
    public double SignalVariance { get; }

    /// <summary>ℓ_q, one per input dimension, in unit-box input units.</summary>
    public ReadOnlySpan<double> LengthScales => _lengthScales;

    /// <summary>σ_n², the nugget added to the diagonal of the covariance, in standardized output units squared.</summary>
    public double NoiseVariance { get; }

    /// <summary>Number of input dimensions d.</summary>
    public int Dimension => _lengthScales.Length;

    /// <summary>Number of log parameters, d + 2.</summary>
    public int LogParameterCount => _lengthScales.Length + 2;

    /// <summary>θ = (ln σ_f², ln ℓ_1, …, ln ℓ_d, ln σ_n²).</summary>
    /// <returns>A new array of length d + 2.</returns>
    public double[] ToLogParameters()
    {
        var theta = new double[LogParameterCount];
        theta[0] = Math.Log(SignalVariance);
        for (int q = 0; q < Dimension; q++)
        {
            theta[q + 1] = Math.Log(_lengthScales[q]);
        }

        theta[^1] = Math.Log(NoiseVariance);
        return theta;
    }

    /// <summary>Inverse of <see cref="ToLogParameters"/>.</summary>
    /// <param name="theta">(ln σ_f², ln ℓ_1, …, ln ℓ_d, ln σ_n²), length at least 3, all finite.</param>
    /// <returns>The hyperparameters.</returns>
    /// <exception cref="ArgumentException">Too short, or a value is not finite.</exception>
    public static GaussianProcessHyperparameters FromLogParameters(ReadOnlySpan<double> theta)
    {
        if (theta.Length < 3)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"theta has length {theta.Length}; at least 3 (one input dimension) are needed."),
                nameof(theta));
        }

        Arguments.RequireFinite(theta, nameof(theta));
        var scales = new double[theta.Length - 2];
        for (int q = 0; q < scales.Length; q++)
        {
            scales[q] = Math.Exp(theta[q + 1]);
        }

        return new GaussianProcessHyperparameters(Math.Exp(theta[0]), scales, Math.Exp(theta[^1]));
    }
}
