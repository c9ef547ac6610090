using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute linear|matter|galaxy</c>.</summary>
internal static class ComputeCommand
{
    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "help", "basis" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args is [] or ["--help" or "-h"] || args.Contains("--help"))
        {
            stdout.Write(HelpText.Compute());
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], Flags);
        string? outPath = arguments.Option("out");
        string? plotPath = arguments.Option("plot");
        if (plotPath is not null && !plotPath.EndsWith(".png", StringComparison.OrdinalIgnoreCase))
        {
            throw new UsageException($"--plot: '{plotPath}' must end in .png");
        }

        if (outPath is not null)
        {
            OutputPath.RequireFolder(outPath, "--out");
        }

        if (plotPath is not null)
        {
            OutputPath.RequireFolder(plotPath, "--plot");
        }

        ComputeResult result = args[0] switch
        {
            "linear" => ComputeLinear.Run(Parse(arguments)),
            "matter" => ComputeMatter.Run(Parse(arguments, MatterLayout.SoundSpeedDefinition, out double cs2), cs2),
            "galaxy" => Galaxy(arguments),
            _ => throw new UsageException($"compute: unknown output '{args[0]}'; expected linear, matter or galaxy"),
        };

        stderr.WriteLine(result.Summary);
        if (outPath is null)
        {
            result.Table.Write(stdout);
        }
        else
        {
            result.Table.WriteFile(outPath);
        }

        if (plotPath is not null)
        {
            result.Figure.Save(plotPath);
            stderr.WriteLine($"figure written to {plotPath}");
        }

        return 0;
    }

    private static PointArguments Parse(CommandArguments arguments)
    {
        var point = PointArguments.Parse(arguments);
        arguments.RejectUnused("see sibyl compute --help");
        return point;
    }

    private static PointArguments Parse(CommandArguments arguments, ParameterDefinition extra, out double value)
    {
        value = Value(arguments, extra);
        return Parse(arguments);
    }

    private static ComputeResult Galaxy(CommandArguments arguments)
    {
        var nuisance = GalaxyLayout.Nuisance.Select(d => Value(arguments, d)).ToArray();
        bool basis = arguments.HasFlag("basis");
        return ComputeGalaxy.Run(Parse(arguments), nuisance, basis);
    }

    private static double Value(CommandArguments arguments, ParameterDefinition definition)
    {
        arguments.MarkUsed([definition.Name]);
        return arguments.Parameters.TryGetValue(definition.Name, out var text)
            ? definition.Check(ParameterCatalog.ParseNumber(definition.Name, text))
            : definition.Default;
    }
}
