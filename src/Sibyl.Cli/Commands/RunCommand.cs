using System.Globalization;
using System.Runtime.InteropServices;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;

namespace Sibyl.Cli.Commands;

/// <summary><c>sibyl run DESIGN</c>: computes the design's points (or one shard of them) on all cores, resumably.</summary>
internal static class RunCommand
{
    private static readonly IReadOnlySet<string> Flags = new HashSet<string>(StringComparer.Ordinal) { "retry-failed" };

    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool interactive)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Run);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], Flags);
        string designPath = args[0];
        string folder = arguments.Option("out") ?? DefaultFolder(designPath);
        int threads = arguments.IntegerOption("threads", Environment.ProcessorCount, 1, 4096);
        bool retry = arguments.HasFlag("retry-failed");
        var shard = ParseShard(arguments.Option("shard"));
        arguments.RejectUnused("see sibyl run --help");
        var design = LoadDesign(designPath);

        var run = new TrainingRun(design, folder, shard, threads, retry);
        var display = new ProgressDisplay(stderr, interactive);
        using var cancel = new CancellationTokenSource();
        using var interrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, Stop);
        using var terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, Stop);
        stderr.WriteLine($"run: design {design.Spec.Name} ({design.Count} points, {design.ChunkCount} chunks), shard {shard}, {threads} threads, results in {folder}");
        RunSummary summary;
        try
        {
            summary = run.Execute(display, line => stderr.WriteLine($"run: {line}"), cancel.Token);
        }
        catch (OperationCanceledException)
        {
            display.Close();
            stderr.WriteLine("run: interrupted; finished chunks are stored, run the same command again to compute the rest");
            return Entry.Interrupted;
        }

        display.Close();
        string rate = summary.PointsComputed > 0
            ? string.Create(CultureInfo.InvariantCulture, $" ({summary.PointsComputed / summary.Elapsed.TotalSeconds:G3} points/s)")
            : "";
        stderr.WriteLine(
            $"run: shard {shard}: {summary.ChunksOwned} chunks, {summary.ChunksReused} already stored, {summary.PointsComputed} points computed in {ProgressDisplay.Duration(summary.Elapsed)}{rate}");
        foreach (var failure in summary.Failures)
        {
            string at = string.Join(", ", design.Spec.Varied.Select((v, c) => string.Create(CultureInfo.InvariantCulture, $"{v.Name}={failure.Parameters[c]:G6}")));
            stderr.WriteLine($"run: point {failure.Index} failed ({at}): {failure.Error}");
        }

        if (summary.Failures.Count > 0)
        {
            stderr.WriteLine($"run: {summary.Failures.Count} point(s) failed and are recorded as such; `sibyl run ... --retry-failed` computes them again");
            return Entry.PointsFailed;
        }

        return 0;

        void Stop(PosixSignalContext context)
        {
            context.Cancel = true;
            cancel.Cancel();
        }
    }

    /// <summary>The run folder beside a design: <c>NAME.design</c> → <c>NAME.run</c>.</summary>
    public static string DefaultFolder(string designPath) => Path.ChangeExtension(designPath, ".run");

    public static TrainingDesign LoadDesign(string path)
    {
        if (!File.Exists(path))
        {
            throw new UsageException($"design file '{path}' not found (make one with sibyl plan SPEC)");
        }

        return TrainingDesign.Load(path);
    }

    private static ShardSelection ParseShard(string? text)
    {
        if (text is null)
        {
            return ShardSelection.All;
        }

        try
        {
            return ShardSelection.Parse(text);
        }
        catch (FormatException e)
        {
            throw new UsageException($"--shard: {e.Message}");
        }
    }
}
