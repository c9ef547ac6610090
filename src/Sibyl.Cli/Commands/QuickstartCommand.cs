using System.Diagnostics;
using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Emulation.Emulators;
using Sibyl.Emulation.Validation;
using Sibyl.Training;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;

namespace Sibyl.Cli.Commands;

/// <summary>
/// <c>sibyl quickstart</c>: the whole job on the built-in grid (training-grids/quickstart.json): plan, run on all
/// cores, merge, fit, check against fresh direct runs, print the measured accuracy. Every step keeps its output in
/// the work folder and a second run reuses whatever is already there and still matches.
/// </summary>
internal static class QuickstartCommand
{
    private const string GridResource = "quickstart.json";

    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "no-serve" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool interactive)
    {
        if (args.Contains("--help"))
        {
            stdout.Write(HelpText.Quickstart);
            return 0;
        }

        var arguments = new CommandArguments(args, Flags);
        string folder = arguments.Option("folder") ?? "sibyl-quickstart";
        int threads = arguments.IntegerOption("threads", Environment.ProcessorCount, 1, 4096);
        bool serve = !arguments.HasFlag("no-serve");
        int port = arguments.IntegerOption("port", Sibyl.Server.SibylServerOptions.DefaultPort, 0, 65535);
        arguments.RejectUnused("see sibyl quickstart --help");
        Directory.CreateDirectory(folder);
        stderr = TextWriter.Synchronized(stderr);
        var clock = Stopwatch.StartNew();

        var spec = GridSpecReader.Parse(BuiltInGrid(), "the built-in quickstart grid");
        var design = Plan(spec, Path.Combine(folder, "quickstart.design"), stderr);
        string runFolder = Path.Combine(folder, "quickstart.run");
        stderr.WriteLine($"quickstart 2/5 run: {design.Count} points of the one-loop matter spectrum on {threads} threads into {runFolder}");
        var summary = Compute(design, runFolder, threads, stderr, interactive);
        stderr.WriteLine($"quickstart 2/5 run: {summary.ChunksReused} of {summary.ChunksOwned} chunks reused, {summary.PointsComputed} points computed, {summary.Failures.Count} failed");

        var set = Merge(design, runFolder, Path.Combine(folder, "quickstart.training"), stderr);
        var emulator = Fit(set, design, Path.Combine(folder, "quickstart.emulator"), threads, stderr);

        const int freshPoints = 40;
        stderr.WriteLine($"quickstart 5/5 check: direct calculation at {freshPoints} fresh points of the box");
        var check = FreshPointCheck.Run(emulator, freshPoints, FreshPointCheck.DefaultSeed(emulator), threads, null, failure => stderr.WriteLine($"quickstart: warning: {failure}"));
        AccuracyOutput.Write(check, "quickstart emulator against fresh direct runs", Path.Combine(folder, "quickstart-check"), stderr);
        AccuracyOutput.Summarize(emulator.Accuracy, "quickstart", stderr);
        AccuracyOutput.Summarize(check, "quickstart", stderr);
        stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"quickstart: built and checked in {clock.Elapsed.TotalSeconds:F0} s; emulator {Path.Combine(folder, "quickstart.emulator")}, valid only inside its box:"));
        for (int q = 0; q < emulator.ParameterNames.Count; q++)
        {
            stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"quickstart:   {emulator.ParameterNames[q]} in [{emulator.Min[q]:G}, {emulator.Max[q]:G}]"));
        }

        string emulatorPath = Path.Combine(folder, "quickstart.emulator");
        if (!serve)
        {
            stdout.WriteLine(emulatorPath);
            return 0;
        }

        string server = port == Sibyl.Server.SibylServerOptions.DefaultPort ? "" : " --server http://ADDRESS:PORT (printed below)";
        stderr.WriteLine($"quickstart: serving it as 'quickstart' over gRPC; ask it with: sibyl ask quickstart omega_cdm=0.12 ln10As=3.0 z=0.5 Omega_rc=0.1 cs2=1{server}; Ctrl-C stops");
        return ServeCommand.Run([$"quickstart={emulatorPath}", "--port", port.ToString(CultureInfo.InvariantCulture)], stdout, stderr);
    }

    private static string BuiltInGrid()
    {
        using var stream = typeof(QuickstartCommand).Assembly.GetManifestResourceStream(GridResource)
            ?? throw new InvalidOperationException($"the built-in grid {GridResource} is missing from this build");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }

    private static TrainingDesign Plan(GridSpec spec, string path, TextWriter stderr)
    {
        if (File.Exists(path))
        {
            try
            {
                var stored = TrainingDesign.Load(path);
                if (GridSpecJson.Hash(stored.Spec) == GridSpecJson.Hash(spec))
                {
                    stderr.WriteLine($"quickstart 1/5 plan: reusing {path}");
                    return stored;
                }
            }
            catch (CorruptFileException e)
            {
                stderr.WriteLine($"quickstart: {e.Message}; planning again");
            }
        }

        var design = TrainingDesign.Create(spec);
        design.Save(path);
        stderr.WriteLine($"quickstart 1/5 plan: {spec.TrainingPoints} training + {spec.HeldOutPoints} held-out points over {string.Join(", ", spec.Varied.Select(v => v.Name))} -> {path}");
        return design;
    }

    private static RunSummary Compute(TrainingDesign design, string runFolder, int threads, TextWriter stderr, bool interactive)
    {
        var display = new ProgressDisplay(stderr, interactive);
        try
        {
            return new TrainingRun(design, runFolder, ShardSelection.All, threads, retryFailed: false).Execute(display, line => stderr.WriteLine($"quickstart: {line}"), CancellationToken.None);
        }
        catch (RunConflictException)
        {
            // The work folder is the quickstart's own: results of an older build are simply recomputed.
            display.Close();
            stderr.WriteLine($"quickstart: {runFolder} holds results of another build of Sibyl; computing them again");
            Directory.Delete(runFolder, recursive: true);
            return new TrainingRun(design, runFolder, ShardSelection.All, threads, retryFailed: false).Execute(display, line => stderr.WriteLine($"quickstart: {line}"), CancellationToken.None);
        }
        finally
        {
            display.Close();
        }
    }

    private static TrainingSet Merge(TrainingDesign design, string runFolder, string path, TextWriter stderr)
    {
        if (Reusable(path, TrainingSet.Load) is { } stored && stored.DesignHash == design.Hash && stored.CodeFingerprint == CodeFingerprint.Current)
        {
            stderr.WriteLine($"quickstart 3/5 merge: reusing {path}");
            return stored;
        }

        var set = TrainingSetMerger.Merge(design, [runFolder]);
        set.Save(path);
        stderr.WriteLine($"quickstart 3/5 merge: training set -> {path}");
        return set;
    }

    private static SpectrumEmulator Fit(TrainingSet set, TrainingDesign design, string path, int threads, TextWriter stderr)
    {
        if (Reusable(path, SpectrumEmulator.Load) is { } stored && stored.DesignHash == design.Hash && stored.CodeFingerprint == set.CodeFingerprint)
        {
            stderr.WriteLine($"quickstart 4/5 fit: reusing {path}");
            return stored;
        }

        stderr.WriteLine("quickstart 4/5 fit: principal components and Gaussian processes, validated on the held-out points");
        var emulator = EmulatorFitter.Fit(set, new EmulatorFitOptions { Threads = threads }, line => stderr.WriteLine($"quickstart {line}"));
        emulator.Save(path);
        AccuracyOutput.Write(emulator.Accuracy, "quickstart emulator against its held-out points", Path.ChangeExtension(path, null) + "-heldout", stderr);
        return emulator;
    }

    private static T? Reusable<T>(string path, Func<string, T> load)
        where T : class
    {
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            return load(path);
        }
        catch (CorruptFileException)
        {
            return null;
        }
    }
}
