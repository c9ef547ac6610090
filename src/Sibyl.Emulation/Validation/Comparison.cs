using System.Globalization;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Emulation.Validation;

/// <summary>One point's emulated and direct values of every term (term-major over k).</summary>
/// <param name="Label">How the point is named in reports (index and parameters).</param>
/// <param name="Emulated">Emulator values.</param>
/// <param name="Direct">Direct-calculation values.</param>
public sealed record Comparison(string Label, double[] Emulated, double[] Direct)
{
    /// <summary>
    /// The comparisons of one point at every redshift slice of <paramref name="emulator"/>; <paramref name="direct"/>
    /// holds the direct values redshift-major, then term-major over k, as a training set and a direct run store them.
    /// </summary>
    public static Comparison[] AtEverySlice(SpectrumEmulator emulator, EmulatorPredictor predictor, int index, IReadOnlyList<double> parameters, ReadOnlySpan<double> direct)
    {
        ArgumentNullException.ThrowIfNull(emulator);
        ArgumentNullException.ThrowIfNull(predictor);
        ArgumentNullException.ThrowIfNull(parameters);
        int size = emulator.Layout.Terms.Count * emulator.K.Count;
        var point = parameters.ToArray();
        var comparisons = new Comparison[emulator.SliceCount];
        for (int s = 0; s < comparisons.Length; s++)
        {
            var emulated = new double[size];
            predictor.Predict(point, s, emulated, [], []);
            comparisons[s] = new Comparison(Name(emulator, index, point, s), emulated, direct.Slice(s * size, size).ToArray());
        }

        return comparisons;
    }

    private static string Name(SpectrumEmulator emulator, int index, double[] parameters, int slice)
    {
        string values = string.Join(", ", emulator.ParameterNames.Select((name, q) => string.Create(CultureInfo.InvariantCulture, $"{name}={parameters[q]:G5}")));
        string z = emulator.Redshifts.Count > 0 ? string.Create(CultureInfo.InvariantCulture, $", z={emulator.Redshifts[slice]:G}") : "";
        return $"point {index} ({values}{z})";
    }
}
