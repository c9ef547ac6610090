using System.Globalization;

namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The one rule for which output wavenumbers a plan over the table range [qMin, qMax] accepts. The plans apply it,
/// and so do callers that check a grid before any plan exists (a training spec), so that a grid accepted early is
/// never refused when the plans are built.
/// </summary>
public static class LoopRange
{
    /// <summary>
    /// Relative slack (dimensionless) when a wavenumber or a table end is compared with a bound computed from another
    /// number. A bound such as 3e-5 · 10 rounds to 3.0000000000000003e-4, and a grid written as 3e-4 must still pass;
    /// 1e-12 is thousands of rounding steps of one multiplication and far below any difference that matters physically.
    /// </summary>
    public const double RelativeTolerance = 1e-12;

    /// <summary>
    /// Finds the first problem with the output wavenumbers <paramref name="k"/> (h/Mpc) for the table range
    /// [<paramref name="qMin"/>, <paramref name="qMax"/>] (h/Mpc). The rule: k is non-empty, finite, positive,
    /// strictly increasing and within [qMin·<see cref="LoopQuadrature.RangeMargin"/>,
    /// qMax/<see cref="LoopQuadrature.RangeMargin"/>] to <see cref="RelativeTolerance"/>.
    /// </summary>
    /// <returns>
    /// Null when k is valid; otherwise the offending index (−1 for an empty grid) and the problem, which starts with
    /// the offending value, so that each caller can name k[i] in its own style.
    /// </returns>
    public static (int Index, string Problem)? FindWavenumberProblem(ReadOnlySpan<double> k, double qMin, double qMax)
    {
        if (k.IsEmpty)
        {
            return (-1, "At least one output wavenumber is needed.");
        }

        double lowest = qMin * LoopQuadrature.RangeMargin;
        double highest = qMax / LoopQuadrature.RangeMargin;
        for (int i = 0; i < k.Length; i++)
        {
            double value = k[i];
            if (!double.IsFinite(value) || value <= 0.0)
            {
                return (i, string.Create(CultureInfo.InvariantCulture, $"{value:G} must be finite and positive"));
            }

            if (i > 0 && value <= k[i - 1])
            {
                return (i, string.Create(CultureInfo.InvariantCulture, $"{value:G} does not exceed k[{i - 1}] = {k[i - 1]:G}; the k grid must increase strictly"));
            }

            if (value < lowest * (1 - RelativeTolerance) || value > highest * (1 + RelativeTolerance))
            {
                return (i, string.Create(
                    CultureInfo.InvariantCulture,
                    $"{value:G} h/Mpc is outside [{lowest:G}, {highest:G}], a factor {LoopQuadrature.RangeMargin:G} inside the table range [{qMin:G}, {qMax:G}] the loops integrate over"));
            }
        }

        return null;
    }
}
