using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Training.Runs;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl merge DESIGN [FOLDER ...]</c>: joins run folders into one training set, or says what is missing.</summary>
internal static class MergeCommand
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Merge);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        string designPath = args[0];
        var folders = args.Skip(1).TakeWhile(a => !a.StartsWith("--", StringComparison.Ordinal)).ToList();
        var arguments = new CommandArguments(args.Skip(1 + folders.Count), new HashSet<string>(StringComparer.Ordinal));
        string output = arguments.Option("out") ?? Path.ChangeExtension(designPath, ".training");
        arguments.RejectUnused("see sibyl merge --help");
        if (folders.Count == 0)
        {
            folders.Add(RunCommand.DefaultFolder(designPath));
        }

        OutputPath.RequireFolder(output, "--out");
        var design = RunCommand.LoadDesign(designPath);
        var set = TrainingSetMerger.Merge(design, folders);
        set.Save(output);
        int failed = Enumerable.Range(0, set.Count).Count(i => set.Error(i) is not null);
        stderr.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"merge: {set.Count} points ({design.Spec.TrainingPoints} training, {design.Spec.HeldOutPoints} held out) from {string.Join(", ", folders)}; code {set.CodeFingerprint}"));
        for (int i = 0; i < set.Count; i++)
        {
            if (set.Error(i) is { } error)
            {
                stderr.WriteLine($"merge: warning: point {i} failed and carries no spectra: {error}");
            }
        }

        if (failed > 0)
        {
            stderr.WriteLine($"merge: warning: {failed} failed point(s) will be left out of any fit");
        }

        stdout.WriteLine(output);
        return 0;
    }
}
