using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl compute linear|matter</c>.</summary>
internal static class ComputeCommand
{
    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "help" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args is [] or ["--help" or "-h"] || args.Contains("--help"))
        {
            stdout.Write(HelpText.Compute());
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], Flags);
        string? outPath = arguments.Option("out");
        CsvTable table;
        string summary;
        switch (args[0])
        {
            case "linear":
            {
                var point = PointArguments.Parse(arguments);
                arguments.RejectUnused("see sibyl compute --help");
                table = ComputeLinear.Table(point);
                summary = ComputeLinear.Summary(point);
                break;
            }

            default:
                throw new UsageException($"compute: unknown output '{args[0]}'; expected linear or matter");
        }

        stderr.WriteLine(summary);
        if (outPath is null)
        {
            table.Write(stdout);
        }
        else
        {
            table.WriteFile(outPath);
        }

        return 0;
    }
}
