using System.Globalization;
namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The argument rules every product-integration plan shares (matter and redshift space), so that all plans
/// accept the same k grids and table ranges.
/// </summary>
internal static class PlanArguments
{
    // Caps the resampling grid so that its scratch buffers fit comfortably on the stack.
    private const double LargestTableRatio = 1e30;

    /// <summary>Throws unless 0 &lt; qMin &lt; qMax ≤ 1e30·qMin, all finite (h/Mpc).</summary>
    public static void ValidateRange(double qMin, double qMax)
    {
        if (!double.IsFinite(qMin) || qMin <= 0.0)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"qMin = {qMin:R} h/Mpc must be finite and positive."), nameof(qMin));
        }

        if (!double.IsFinite(qMax) || qMax <= qMin || qMax / qMin > LargestTableRatio)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"qMax = {qMax:R} h/Mpc must be finite, above qMin = {qMin:R} and at most {LargestTableRatio:R} times it."),
                nameof(qMax));
        }
    }

    /// <summary>Throws unless <see cref="LoopRange.FindWavenumberProblem"/> finds no problem with k.</summary>
    public static void ValidateWavenumbers(ReadOnlySpan<double> k, double qMin, double qMax)
    {
        if (LoopRange.FindWavenumberProblem(k, qMin, qMax) is (int index, string problem))
        {
            throw new ArgumentException(index < 0 ? problem : $"k[{index}] = {problem}.", nameof(k));
        }
    }

    /// <summary>Throws unless the spectrum spans [qMin, qMax] and the result holds kCount wavenumbers.</summary>
    public static void ValidateInputs(
        LogSampledSpectrum spectrum,
        int resultKCount,
        double qMin,
        double qMax,
        int kCount,
        string spectrumName,
        string resultName)
    {
        if (!spectrum.HasSameRangeAs(qMin, qMax))
        {
            throw new ArgumentException(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"The spectrum spans [{spectrum.QMin:R}, {spectrum.QMax:R}] h/Mpc but the plan was built for [{qMin:R}, {qMax:R}]."),
                spectrumName);
        }

        if (resultKCount != kCount)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"The result holds {resultKCount} wavenumbers but the plan has {kCount}."),
                resultName);
        }
    }

    /// <summary>Throws unless the two results of a two-spectrum evaluation are different objects (one would overwrite the other).</summary>
    public static void RequireDistinct(object firstResult, object secondResult, string secondName)
    {
        if (ReferenceEquals(firstResult, secondResult))
        {
            throw new ArgumentException("The two results must be distinct objects.", secondName);
        }
    }
}
