using System.Diagnostics;
using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Emulation.Emulators;
using Sibyl.Emulation.Gaussian;
using Sibyl.Training;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl fit TRAINING</c>: fits an emulator, validates it on the held-out points, writes it and its report.</summary>
internal static class FitCommand
{
    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "variance" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Fit);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], Flags);
        string trainingPath = args[0];
        string output = arguments.Option("out") ?? Path.ChangeExtension(trainingPath, ".emulator");
        string report = arguments.Option("report") ?? Path.ChangeExtension(output, null) + "-heldout";
        var defaults = new EmulatorFitOptions();
        var options = defaults with
        {
            Kernel = Choice(arguments.Option("kernel"), "kernel", new() { ["matern52"] = KernelKind.Matern52, ["se"] = KernelKind.SquaredExponential }, defaults.Kernel),
            SeparateComponents = arguments.IntegerOption("separate", defaults.SeparateComponents, 0, 1000),
            TrendDegree = arguments.IntegerOption("trend", defaults.TrendDegree, 0, 2),
            HyperparameterPoints = arguments.IntegerOption("hyper-points", defaults.HyperparameterPoints, 10, 100_000),
            ComponentTolerance = arguments.NumberOption("pca-tolerance", defaults.ComponentTolerance, 1e-10, 1),
            Restarts = arguments.IntegerOption("restarts", defaults.Restarts, 0, 100),
            KeepVariance = arguments.HasFlag("variance"),
            Threads = arguments.IntegerOption("threads", defaults.Threads, 1, 4096),
        };
        arguments.RejectUnused("see sibyl fit --help");
        if (!File.Exists(trainingPath))
        {
            throw new UsageException($"fit: training set '{trainingPath}' not found (make one with sibyl merge)");
        }

        OutputPath.RequireFolder(output, "--out");
        OutputPath.RequireFolder(report, "--report");

        // Progress arrives from worker threads.
        stderr = TextWriter.Synchronized(stderr);
        var set = TrainingSet.Load(trainingPath);
        int failed = Enumerable.Range(0, set.Count).Count(i => set.Error(i) is not null);
        if (failed > 0)
        {
            stderr.WriteLine($"fit: warning: {failed} failed point(s) of the training set are left out");
        }

        var clock = Stopwatch.StartNew();
        var emulator = EmulatorFitter.Fit(set, options, line => stderr.WriteLine(line));
        emulator.Save(output);
        stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"fit: {emulator.TrainingCount} training points, {set.Spec.Varied.Count} parameters, fitted and validated in {clock.Elapsed.TotalSeconds:F1} s; emulator written to {output}"));
        AccuracyOutput.Summarize(emulator.Accuracy, "fit", stderr);
        AccuracyOutput.Write(emulator.Accuracy, $"emulator {output} against the held-out points of {trainingPath}", report, stderr);
        stdout.WriteLine(output);
        return 0;
    }

    private static T Choice<T>(string? text, string option, Dictionary<string, T> choices, T fallback)
    {
        if (text is null)
        {
            return fallback;
        }

        return choices.TryGetValue(text, out var value) ? value : throw new UsageException($"--{option}: must be one of {string.Join(", ", choices.Keys)}, got '{text}'");
    }
}
