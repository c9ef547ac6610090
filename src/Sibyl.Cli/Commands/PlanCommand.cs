using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Training.Design;
using Sibyl.Training.Specs;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl plan SPEC</c>: draws the design of a grid spec and writes the design file.</summary>
internal static class PlanCommand
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Plan);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], new HashSet<string>(StringComparer.Ordinal));
        string specPath = args[0];
        string output = arguments.Option("out") ?? $"{Path.GetFileNameWithoutExtension(specPath)}.design";
        arguments.RejectUnused("see sibyl plan --help");
        if (!File.Exists(specPath))
        {
            throw new UsageException($"plan: spec file '{specPath}' not found");
        }

        OutputPath.RequireFolder(output, "--out");
        var spec = GridSpecReader.ReadFile(specPath);
        var design = TrainingDesign.Create(spec);
        design.Save(output);
        stderr.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"plan: {spec.TrainingPoints} training + {spec.HeldOutPoints} held-out points over {string.Join(", ", spec.Varied.Select(v => v.Name))}; " +
            $"{design.ChunkCount} chunks of {spec.ChunkSize}; maximin phi_20 {design.CriterionBefore:G4} -> {design.CriterionAfter:G4}, " +
            $"smallest distance {design.MinimumDistance:G3} (unit cube)"));
        stdout.WriteLine(output);
        return 0;
    }
}
