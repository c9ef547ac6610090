using System.Globalization;
using Sibyl.Emulation.Emulators;
using Sibyl.Emulation.Validation;
using Sibyl.V1;

namespace Sibyl.Server.Internal;

/// <summary>
/// One loaded emulator as the server sees it: its name, the lookups that turn a request's names into positions, the
/// spline over its k grid, its description (built once), and one <see cref="PredictionWorkspace"/> per thread.
/// </summary>
internal sealed partial class ServedEmulator : IDisposable
{
    private readonly Dictionary<string, int> _parameterIndex;
    private readonly double[] _k;
    private readonly string[] _observables;
    private readonly string[] _termNames;
    private readonly string _parameterList;
    private readonly KnotSpline _spline;
    private readonly ThreadLocal<PredictionWorkspace> _workspaces;

    public ServedEmulator(string name, SpectrumEmulator emulator, int maxKValues)
    {
        Name = name;
        Emulator = emulator;
        MaxKValues = maxKValues;
        _parameterIndex = emulator.ParameterNames.Select((p, q) => (p, q)).ToDictionary(x => x.p, x => x.q, StringComparer.Ordinal);
        _k = [.. emulator.K];
        _observables = [.. emulator.Layout.Observables];
        _termNames = [.. emulator.Layout.Terms.Select(t => t.Name)];
        _parameterList = string.Join(", ", emulator.ParameterNames.Select((p, q) => string.Create(CultureInfo.InvariantCulture, $"{p} in [{emulator.Min[q]:G}, {emulator.Max[q]:G}]")));
        _spline = new KnotSpline([.. _k.Select(k => Math.Log(k))]);
        _workspaces = new ThreadLocal<PredictionWorkspace>(() => new PredictionWorkspace(emulator));
        Description = Describe();
    }

    /// <summary>The name requests use.</summary>
    public string Name { get; }

    public SpectrumEmulator Emulator { get; }

    /// <summary>Most k values one request may ask for.</summary>
    public int MaxKValues { get; }

    /// <summary>What Describe answers for this emulator; shared, never modified after construction.</summary>
    public EmulatorDescription Description { get; }

    /// <summary>One line for the console: name, parameters, slices and measured accuracy.</summary>
    public string Summary()
    {
        var accuracy = Emulator.Accuracy;
        string slices = Emulator.Redshifts.Count == 0
            ? "z an input"
            : "z = " + string.Join(", ", Emulator.Redshifts.Select(z => z.ToString("G", CultureInfo.InvariantCulture)));
        string errors = string.Join(", ", Enumerable.Range(0, accuracy.TermNames.Count)
            .Select(t => $"{accuracy.TermNames[t]} {AccuracyReport.Format(accuracy.Worst99(t), accuracy.IsRelative(t))}"));
        return string.Create(
            CultureInfo.InvariantCulture,
            $"{Name} ({string.Join(" ", Emulator.ParameterNames)}; {slices}; {_k.Length} k in [{_k[0]:G}, {_k[^1]:G}] h/Mpc; 99th-percentile {accuracy.Source} error at k <= {AccuracyReport.HeadlineKMax:G}: {errors})");
    }

    public void Dispose() => _workspaces.Dispose();

    private EmulatorDescription Describe()
    {
        var e = Emulator;
        var layout = e.Layout;
        var description = new EmulatorDescription
        {
            Name = Name,
            AccuracySource = e.Accuracy.Source,
            AccuracyPoints = e.Accuracy.Points,
            HasVariance = e.HasVariance,
            TrainingPoints = e.TrainingCount,
        };
        for (int q = 0; q < e.ParameterNames.Count; q++)
        {
            description.Parameters.Add(new ParameterRange { Name = e.ParameterNames[q], Min = e.Min[q], Max = e.Max[q] });
        }

        description.Redshifts.AddRange(e.Redshifts);
        description.Observables.AddRange(layout.Observables);
        description.Nuisance.AddRange(layout.Nuisance);
        foreach (var term in layout.Terms)
        {
            var t = new BasisTermDescription { Name = term.Name, Observable = layout.Observables[term.Observable], Prefactor = term.Prefactor };
            t.NuisanceFactors.AddRange(term.NuisanceFactors.Select(f => layout.Nuisance[f]));
            description.Terms.Add(t);
        }

        description.K.AddRange(_k);
        var accuracy = e.Accuracy;
        for (int t = 0; t < accuracy.TermNames.Count; t++)
        {
            var a = new TermAccuracy
            {
                Term = accuracy.TermNames[t],
                Relative = accuracy.IsRelative(t),
                WorstP99 = accuracy.Worst99(t),
                HeadlineKMax = AccuracyReport.HeadlineKMax,
            };
            a.P99.AddRange(accuracy.Curve(t, 99).ToArray());
            description.Accuracy.Add(a);
        }

        return description;
    }
}
