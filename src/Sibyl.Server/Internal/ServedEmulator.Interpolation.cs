namespace Sibyl.Server.Internal;

/// <summary>
/// Interpolation of every basis term from the emulator's grid to requested k: a not-a-knot cubic spline in ln k of
/// ln |term| where the term keeps one sign over the grid (spectra are close to power laws there, so the log is smooth
/// and the spline's error is smallest), else of the term itself. Variances and gradients follow the same map: for a
/// logarithmic term the spline carries var/term² and gradient/term (the relative quantities, smooth like ln |term|) and
/// they are scaled back by the interpolated term, which makes the gradient the exact derivative of the interpolated
/// value.
/// </summary>
internal sealed partial class ServedEmulator
{
    private void Interpolate(PredictionWorkspace w, int count, bool variance, bool gradient)
    {
        int d = Emulator.ParameterNames.Count, nk = _k.Length;
        var points = w.Points.AsSpan(0, count);
        var knots = w.Knots.AsSpan();
        var curvature = w.Curvature.AsSpan();
        var column = w.Column.AsSpan(0, count);
        for (int t = 0; t < _termNames.Length; t++)
        {
            var row = w.Values.AsSpan(t * nk, nk);
            var output = w.OutValues.AsSpan(t * count, count);
            double sign = OneSign(row);
            if (sign != 0.0)
            {
                for (int i = 0; i < nk; i++)
                {
                    knots[i] = Math.Log(Math.Abs(row[i]));
                }

                _spline.Evaluate(knots, points, curvature, output);
                for (int j = 0; j < count; j++)
                {
                    output[j] = sign * Math.Exp(output[j]);
                }
            }
            else
            {
                _spline.Evaluate(row, points, curvature, output);
            }

            if (variance)
            {
                var source = w.Variance.AsSpan(t * nk, nk);
                for (int i = 0; i < nk; i++)
                {
                    knots[i] = sign != 0.0 ? source[i] / (row[i] * row[i]) : source[i];
                }

                _spline.Evaluate(knots, points, curvature, column);
                var target = w.OutVariance.AsSpan(t * count, count);
                for (int j = 0; j < count; j++)
                {
                    // The spline may undershoot zero between small variances; a variance cannot be negative.
                    target[j] = Math.Max(0.0, column[j]) * (sign != 0.0 ? output[j] * output[j] : 1.0);
                }
            }

            if (gradient)
            {
                var source = w.Gradient.AsSpan(t * nk * d, nk * d);
                var target = w.OutGradient.AsSpan(t * count * d, count * d);
                for (int q = 0; q < d; q++)
                {
                    for (int i = 0; i < nk; i++)
                    {
                        knots[i] = sign != 0.0 ? source[(i * d) + q] / row[i] : source[(i * d) + q];
                    }

                    _spline.Evaluate(knots, points, curvature, column);
                    for (int j = 0; j < count; j++)
                    {
                        target[(j * d) + q] = column[j] * (sign != 0.0 ? output[j] : 1.0);
                    }
                }
            }
        }
    }

    /// <summary>+1 or −1 when every value has that sign (none zero), else 0.</summary>
    private static double OneSign(ReadOnlySpan<double> row)
    {
        bool positive = true, negative = true;
        foreach (double v in row)
        {
            positive &= v > 0.0;
            negative &= v < 0.0;
        }

        return positive ? 1.0 : negative ? -1.0 : 0.0;
    }
}
