using Grpc.Core;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Client;
using Sibyl.Cosmology.Parameters;
using Sibyl.V1;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl ask NAME name=value ...</c>: asks a running server for one point and prints it as CSV.</summary>
internal static class AskCommand
{
    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "basis", "variance", "gradient", "extrapolate" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Ask);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], Flags);
        string name = args[0];
        string server = arguments.Option("server") ?? $"http://127.0.0.1:{Server.SibylServerOptions.DefaultPort}";
        string? z = arguments.Option("z");
        string? k = arguments.Option("k");
        double timeout = arguments.NumberOption("timeout", 30, 0.001, 3600);
        var request = new PredictRequest
        {
            Emulator = name,
            IncludeBasis = arguments.HasFlag("basis"),
            IncludeVariance = arguments.HasFlag("variance"),
            IncludeGradient = arguments.HasFlag("gradient"),
            AllowExtrapolation = arguments.HasFlag("extrapolate"),
        };
        if (z is not null)
        {
            request.Z = ParameterCatalog.ParseNumber("--z", z);
        }

        if (k is not null)
        {
            request.K.AddRange(k.Split(',').Select(v => ParameterCatalog.ParseNumber("--k", v)));
        }

        arguments.MarkUsed(arguments.Parameters.Keys);
        arguments.RejectUnused("see sibyl ask --help");
        if (!Uri.TryCreate(server, UriKind.Absolute, out var address) || address.Scheme is not ("http" or "https"))
        {
            throw new UsageException($"--server: '{server}' is not an http:// or https:// address");
        }

        using var client = new SibylClient(address);
        var deadline = DateTime.UtcNow.AddSeconds(timeout);
        try
        {
            var description = client.Raw.Describe(new DescribeRequest { Emulator = name }, deadline: deadline).Emulators[0];
            foreach (var (key, text) in arguments.Parameters)
            {
                double value = ParameterCatalog.ParseNumber(key, text);
                if (description.Nuisance.Contains(key))
                {
                    request.Nuisance[key] = value;
                }
                else
                {
                    // Unknown names go to the server as parameters, which refuses them with the list it knows.
                    request.Parameters[key] = value;
                }
            }

            var reply = client.Raw.Predict(request, deadline: deadline);
            Table(reply).Write(stdout);
            if (reply.Extrapolated)
            {
                stderr.WriteLine("ask: warning: the point lies outside the emulator's box; the values are extrapolated");
            }

            return 0;
        }
        catch (RpcException e) when (e.StatusCode is StatusCode.InvalidArgument or StatusCode.OutOfRange or StatusCode.NotFound or StatusCode.ResourceExhausted)
        {
            stderr.WriteLine($"sibyl: ask: {e.Status.Detail}");
            return Entry.UsageError;
        }
        catch (RpcException e)
        {
            stderr.WriteLine($"sibyl: ask: {server}: {e.StatusCode}: {e.Status.Detail}");
            return Entry.IoError;
        }
    }

    /// <summary>k, then each observable, each basis term, their variances and their gradients, one column each.</summary>
    private static CsvTable Table(PredictReply reply)
    {
        var series = reply.Observables.Concat(reply.Terms).ToList();
        var columns = new List<string> { "k" };
        columns.AddRange(series.Select(s => s.Name));
        columns.AddRange(series.Where(s => s.Variance.Count > 0).Select(s => $"var_{s.Name}"));
        foreach (var s in series.Where(s => s.Gradient.Count > 0))
        {
            columns.AddRange(reply.GradientParameters.Select(p => $"d{s.Name}/d{p}"));
        }

        var table = new CsvTable(columns);
        int d = reply.GradientParameters.Count;
        for (int i = 0; i < reply.K.Count; i++)
        {
            var row = new List<double> { reply.K[i] };
            row.AddRange(series.Select(s => s.Values[i]));
            row.AddRange(series.Where(s => s.Variance.Count > 0).Select(s => s.Variance[i]));
            foreach (var s in series.Where(s => s.Gradient.Count > 0))
            {
                row.AddRange(Enumerable.Range(0, d).Select(q => s.Gradient[(i * d) + q]));
            }

            table.Add([.. row]);
        }

        return table;
    }
}
