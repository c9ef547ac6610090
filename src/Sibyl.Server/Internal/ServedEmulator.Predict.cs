using System.Globalization;
using Google.Protobuf.Collections;
using Sibyl.Cosmology.Parameters;
using Sibyl.V1;

namespace Sibyl.Server.Internal;

/// <summary>The request path: validate at the edge, predict on the grid, interpolate to the requested k, assemble.</summary>
internal sealed partial class ServedEmulator
{
    /// <summary>Answers one request with this thread's workspace.</summary>
    /// <exception cref="RequestRejectedException">The request is malformed or out of range.</exception>
    /// <exception cref="ParameterOutOfRangeException">A parameter outside the box, or a redshift without a slice.</exception>
    public PredictReply Predict(PredictRequest request)
    {
        var w = _workspaces.Value!;
        var e = Emulator;
        int d = e.ParameterNames.Count, nk = _k.Length, terms = _termNames.Length;
        ReadParameters(request.Parameters, w.Parameters);
        int slice = ReadSlice(request);
        ReadNuisance(request.Nuisance, w.Nuisance);
        bool variance = request.IncludeVariance, gradient = request.IncludeGradient;
        if (variance && !e.HasVariance)
        {
            throw StatusMapping.Invalid($"include_variance: emulator '{Name}' was fitted without variances (refit it with sibyl fit --variance)");
        }

        bool custom = request.K.Count > 0;
        int count = custom ? request.K.Count : nk;
        if (custom)
        {
            Locate(request.K, w);
        }

        bool inside = w.Predictor.Predict(w.Parameters, slice, w.Values, variance ? w.Variance : [], gradient ? w.Gradient : [], request.AllowExtrapolation);
        if (custom)
        {
            Interpolate(w, count, variance, gradient);
        }

        double[] values = custom ? w.OutValues : w.Values, variances = custom ? w.OutVariance : w.Variance, gradients = custom ? w.OutGradient : w.Gradient;
        var layout = e.Layout;
        for (int t = 0; t < terms; t++)
        {
            w.Coefficients[t] = layout.Coefficient(t, w.Nuisance);
            w.SquaredCoefficients[t] = w.Coefficients[t] * w.Coefficients[t];
        }

        var reply = new PredictReply { Extrapolated = !inside };
        if (custom)
        {
            reply.K.AddRange(request.K);
        }
        else
        {
            reply.K.AddRange(_k);
        }

        if (gradient)
        {
            reply.GradientParameters.AddRange(e.ParameterNames);
        }

        for (int o = 0; o < _observables.Length; o++)
        {
            reply.Observables.Add(Observable(w, o, count, values, variance ? variances : null, gradient ? gradients : null));
        }

        if (request.IncludeBasis)
        {
            for (int t = 0; t < terms; t++)
            {
                var series = new Series { Name = _termNames[t] };
                Append(series.Values, values.AsSpan(t * count, count));
                if (variance)
                {
                    Append(series.Variance, variances.AsSpan(t * count, count));
                }

                if (gradient)
                {
                    Append(series.Gradient, gradients.AsSpan(t * count * d, count * d));
                }

                reply.Terms.Add(series);
            }
        }

        return reply;
    }

    /// <summary>One observable and, on request, its variance (Σ c² var, the terms' processes being independent) and gradient, assembled by <see cref="Perturbation.Spectra.BasisLayout.Combine"/> as in process.</summary>
    private Series Observable(PredictionWorkspace w, int observable, int count, double[] values, double[]? variances, double[]? gradients)
    {
        var layout = Emulator.Layout;
        int d = Emulator.ParameterNames.Count;
        var series = new Series { Name = _observables[observable] };
        var sum = w.Column.AsSpan(0, count);
        layout.Combine(values, count, w.Coefficients, observable, sum);
        Append(series.Values, sum);
        if (variances is not null)
        {
            layout.Combine(variances, count, w.SquaredCoefficients, observable, sum);
            Append(series.Variance, sum);
        }

        if (gradients is not null)
        {
            var total = w.GradientColumn.AsSpan(0, count * d);
            layout.Combine(gradients, count * d, w.Coefficients, observable, total);
            Append(series.Gradient, total);
        }

        return series;
    }

    private static void Append(RepeatedField<double> field, ReadOnlySpan<double> values)
    {
        field.Capacity = field.Count + values.Length;
        foreach (double v in values)
        {
            field.Add(v);
        }
    }

    private void ReadParameters(MapField<string, double> given, double[] parameters)
    {
        var names = Emulator.ParameterNames;
        for (int q = 0; q < names.Count; q++)
        {
            if (!given.TryGetValue(names[q], out double v))
            {
                throw StatusMapping.Invalid($"{names[q]}: missing; emulator '{Name}' needs {_parameterList}");
            }

            if (!double.IsFinite(v))
            {
                throw StatusMapping.Invalid(string.Create(CultureInfo.InvariantCulture, $"{names[q]}: must be finite, got {v}; the emulator's box is [{Emulator.Min[q]:G}, {Emulator.Max[q]:G}]"));
            }

            parameters[q] = v;
        }

        if (given.Count != names.Count)
        {
            string unknown = given.Keys.First(k => !_parameterIndex.ContainsKey(k));
            throw StatusMapping.Invalid($"{unknown}: unknown parameter of emulator '{Name}', which takes {_parameterList}");
        }
    }

    private int ReadSlice(PredictRequest request)
    {
        var redshifts = Emulator.Redshifts;
        if (redshifts.Count == 0)
        {
            return request.HasZ
                ? throw StatusMapping.Invalid($"z: emulator '{Name}' has no fixed redshift slices; give z in parameters if it is one of its inputs ({_parameterList})")
                : 0;
        }

        if (!request.HasZ)
        {
            throw StatusMapping.Invalid($"z: missing; emulator '{Name}' was trained at z = {string.Join(", ", redshifts.Select(z => z.ToString("G", CultureInfo.InvariantCulture)))}");
        }

        return double.IsFinite(request.Z)
            ? Emulator.SliceOf(request.Z)
            : throw StatusMapping.Invalid(string.Create(CultureInfo.InvariantCulture, $"z: must be finite, got {request.Z}"));
    }

    private void ReadNuisance(MapField<string, double> given, double[] nuisance)
    {
        var names = Emulator.Layout.Nuisance;
        int found = 0;
        for (int i = 0; i < names.Count; i++)
        {
            if (given.TryGetValue(names[i], out double v))
            {
                if (!double.IsFinite(v))
                {
                    throw StatusMapping.Invalid(string.Create(CultureInfo.InvariantCulture, $"{names[i]}: nuisance value must be finite, got {v}"));
                }

                found++;
            }

            nuisance[i] = v;
        }

        if (found != given.Count)
        {
            string unknown = given.Keys.First(k => !names.Contains(k, StringComparer.Ordinal));
            throw StatusMapping.Invalid($"{unknown}: unknown nuisance parameter of emulator '{Name}', which takes {(names.Count == 0 ? "none" : string.Join(", ", names))}");
        }
    }

    private void Locate(RepeatedField<double> k, PredictionWorkspace w)
    {
        if (k.Count > MaxKValues)
        {
            throw StatusMapping.Invalid($"k: {k.Count} values requested, at most {MaxKValues} per request");
        }

        // A client that rebuilds the grid's ends (say from a log spacing) can miss them by a few ulp; 1e-12 relative
        // admits that and nothing meant as outside, and the spline clamps such a k onto the end knot.
        double low = _k[0] * (1.0 - 1e-12), high = _k[^1] * (1.0 + 1e-12);
        w.EnsureOutput(k.Count, Emulator.ParameterNames.Count, _termNames.Length);
        for (int j = 0; j < k.Count; j++)
        {
            double value = k[j];
            if (!double.IsFinite(value) || value <= 0.0)
            {
                throw StatusMapping.Invalid(string.Create(CultureInfo.InvariantCulture, $"k[{j}]: must be finite and positive, got {value}"));
            }

            if (value < low || value > high)
            {
                throw StatusMapping.OutOfRange(string.Create(CultureInfo.InvariantCulture, $"k[{j}]: {value:G} h/Mpc is outside emulator '{Name}''s k range [{_k[0]:G}, {_k[^1]:G}] h/Mpc"));
            }

            w.Points[j] = _spline.Locate(Math.Log(value));
        }
    }
}
