using Sibyl.Emulation.Emulators;
using Sibyl.Perturbation.Spectra;
using Sibyl.V1;

namespace Sibyl.Server.Tests;

/// <summary>The same point evaluated in process: what the server must return.</summary>
public sealed class Reference
{
    public Reference(SpectrumEmulator emulator, double[] parameters, int slice, IReadOnlyDictionary<string, double>? nuisance = null)
    {
        int size = emulator.Layout.Terms.Count * emulator.K.Count;
        Terms = new double[size];
        Variance = emulator.HasVariance ? new double[size] : [];
        Gradient = new double[size * emulator.ParameterNames.Count];
        emulator.CreatePredictor().Predict(parameters, slice, Terms, Variance, Gradient, allowExtrapolation: true);
        Nuisance = [.. emulator.Layout.Nuisance.Select(n => nuisance is not null && nuisance.TryGetValue(n, out double v) ? v : 0.0)];
        var spectra = new BasisSpectra(emulator.Layout, [.. emulator.K], Terms);
        Observables = [.. Enumerable.Range(0, emulator.Layout.Observables.Count).Select(o =>
        {
            var destination = new double[emulator.K.Count];
            spectra.Assemble(Nuisance, o, destination);
            return destination;
        })];
    }

    /// <summary>Terms × k, as the predictor writes them.</summary>
    public double[] Terms { get; }

    public double[] Variance { get; }

    public double[] Gradient { get; }

    public double[] Nuisance { get; }

    /// <summary>Each observable assembled by <see cref="BasisSpectra.Assemble"/>.</summary>
    public double[][] Observables { get; }

    /// <summary>A request for the fixture's slices emulator.</summary>
    public static PredictRequest Slices(double omegaCdm, double sigma8, double z, double? cs2 = null)
    {
        var request = new PredictRequest { Emulator = "slices", Z = z };
        request.Parameters.Add("omega_cdm", omegaCdm);
        request.Parameters.Add("sigma8", sigma8);
        if (cs2 is { } value)
        {
            request.Nuisance.Add("cs2", value);
        }

        return request;
    }
}
