using System.Globalization;
using Sibyl.Cli.Arguments;
using Sibyl.Cli.Output;
using Sibyl.Emulation.Emulators;
using Sibyl.Emulation.Validation;

namespace Sibyl.Cli.Commands;

/// <summary>
/// <c>sibyl check EMULATOR</c>: draws fresh points in the emulator's box (a new Latin hypercube, neither training nor
/// held-out points), runs the direct calculation there and reports how far the emulator is from it.
/// </summary>
internal static class CheckCommand
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        if (args.Contains("--help") || args.Length == 0)
        {
            stdout.Write(HelpText.Check);
            return args.Length == 0 ? Entry.UsageError : 0;
        }

        var arguments = new CommandArguments(args[1..], new HashSet<string>(StringComparer.Ordinal));
        string emulatorPath = args[0];
        int points = arguments.IntegerOption("points", 50, 2, 1_000_000);
        int threads = arguments.IntegerOption("threads", Environment.ProcessorCount, 1, 4096);
        string? seedText = arguments.Option("seed");
        string report = arguments.Option("report") ?? Path.ChangeExtension(emulatorPath, null) + "-check";
        double? limit = arguments.Option("max-error") is null ? null : arguments.NumberOption("max-error", 0, 0, 1);
        arguments.RejectUnused("see sibyl check --help");
        if (!File.Exists(emulatorPath))
        {
            throw new UsageException($"check: emulator '{emulatorPath}' not found (make one with sibyl fit)");
        }

        OutputPath.RequireFolder(report, "--report");

        // Progress arrives from worker threads.
        stderr = TextWriter.Synchronized(stderr);
        var emulator = SpectrumEmulator.Load(emulatorPath);
        ulong seed = seedText is null ? FreshPointCheck.DefaultSeed(emulator) : ParseSeed(seedText);
        stderr.WriteLine($"check: {points} fresh points in the box of {emulatorPath} (seed {seed}), direct calculation on {threads} threads");
        var measured = FreshPointCheck.Run(
            emulator,
            points,
            seed,
            threads,
            done =>
            {
                if (done % Math.Max(1, points / 10) == 0 || done == points)
                {
                    stderr.WriteLine($"check: {done}/{points} points");
                }
            },
            failure => stderr.WriteLine($"check: warning: the direct calculation failed at {failure}"));
        AccuracyOutput.Summarize(measured, "check", stderr);
        AccuracyOutput.Write(measured, $"emulator {emulatorPath} against fresh direct runs", report, stderr);
        stderr.WriteLine($"check: training set computed by build {emulator.CodeFingerprint}, direct runs now by build {Training.Storage.CodeFingerprint.Current}");
        if (limit is { } bound)
        {
            for (int t = 0; t < measured.TermNames.Count; t++)
            {
                if (measured.Worst99(t) > bound)
                {
                    stderr.WriteLine(string.Create(CultureInfo.InvariantCulture, $"check: {measured.TermNames[t]} exceeds --max-error {bound:G}"));
                    return Entry.CheckFailed;
                }
            }
        }

        return 0;
    }

    private static ulong ParseSeed(string text) =>
        ulong.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed) ? seed : throw new UsageException($"--seed: must be a non-negative integer, got '{text}'");
}
