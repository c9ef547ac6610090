using Sibyl.Client;
using Sibyl.Perturbation.Spectra;
using Sibyl.V1;

namespace Sibyl.Demo.Theory;

/// <summary>
/// An emulator served by <c>sibyl serve</c>: Describe gives the box, k grid and basis layout once; every batch of the
/// sampler is one PredictBatch call with the basis terms requested, which become <see cref="BasisSpectra"/> with that
/// layout, so the likelihood is the same code as for the in-process emulator.
/// </summary>
public sealed class ServerTheory : ISpectrumTheory, IDisposable
{
    private readonly SibylClient _client;
    private readonly string _name;
    private readonly BasisLayout _layout;
    private readonly double[] _k;
    private readonly double? _z;

    private ServerTheory(SibylClient client, string name, EmulatorDescription description, double redshift)
    {
        _client = client;
        _name = name;
        _k = [.. description.K];
        ParameterNames = [.. description.Parameters.Select(p => p.Name)];
        Min = [.. description.Parameters.Select(p => p.Min)];
        Max = [.. description.Parameters.Select(p => p.Max)];

        // An emulator trained at fixed redshifts takes z beside the parameters; the server refuses an untrained one.
        _z = description.Redshifts.Count > 0 ? redshift : null;
        var observables = description.Observables.ToList();
        var nuisance = description.Nuisance.ToList();
        _layout = new BasisLayout(
            observables,
            nuisance,
            [.. description.Terms.Select(t => new BasisTerm(t.Name, observables.IndexOf(t.Observable), t.Prefactor, [.. t.NuisanceFactors.Select(f => nuisance.IndexOf(f))]))]);
        Description = $"served emulator '{name}' ({description.TrainingPoints} training points)";
        Redshift = redshift;
    }

    /// <inheritdoc/>
    public string Description { get; }

    /// <inheritdoc/>
    public IReadOnlyList<string> ParameterNames { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> Min { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> Max { get; }

    /// <inheritdoc/>
    public IReadOnlyList<double> K => _k;

    /// <inheritdoc/>
    public double Redshift { get; }

    /// <summary>Connects to <paramref name="server"/> and describes emulator <paramref name="name"/>.</summary>
    public static async Task<ServerTheory> ConnectAsync(Uri server, string name, double redshift)
    {
        var client = new SibylClient(server);
        try
        {
            return new ServerTheory(client, name, await client.DescribeAsync(name).ConfigureAwait(false), redshift);
        }
        catch
        {
            client.Dispose();
            throw;
        }
    }

    /// <inheritdoc/>
    public async Task<BasisSpectra[]> PredictAsync(IReadOnlyList<double[]> points, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(points);
        var requests = points.Select(point =>
        {
            TheoryBox.Check(this, point);
            var request = SibylClient.Point(_name, ParameterNames.Select((n, q) => new KeyValuePair<string, double>(n, point[q])), _z);
            request.IncludeBasis = true;
            return request;
        }).ToList();
        var replies = await _client.PredictBatchAsync(requests, cancellation).ConfigureAwait(false);
        return [.. replies.Select(ToSpectra)];
    }

    /// <inheritdoc/>
    public void Dispose() => _client.Dispose();

    private BasisSpectra ToSpectra(PredictReply reply)
    {
        int nk = _k.Length;
        var values = new double[_layout.Terms.Count * nk];
        var byName = reply.Terms.ToDictionary(t => t.Name, StringComparer.Ordinal);
        for (int t = 0; t < _layout.Terms.Count; t++)
        {
            var series = byName[_layout.Terms[t].Name].Values;
            for (int i = 0; i < nk; i++)
            {
                values[(t * nk) + i] = series[i];
            }
        }

        return new BasisSpectra(_layout, _k, values);
    }
}
