using System.Diagnostics;
using System.Globalization;
using System.Text;
using Sibyl.Demo.Likelihood;
using Sibyl.Demo.Sampling;
using Sibyl.Demo.Survey;
using Sibyl.Demo.Theory;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Demo.Commands;

/// <summary>
/// <c>compare</c>: the chain's points through both theories. The emulator is trusted for this analysis when the
/// likelihood it gives differs from the direct one by much less than 1 (DESIGN.md: |Δχ²| &lt; 0.1 for 99 % of points);
/// the wall-clock time per likelihood of each gives the speed-up of a chain on the emulator.
/// </summary>
public static class CompareCommand
{
    /// <summary>Usage text.</summary>
    public const string Help = """
        usage: survey-demo compare --scenario FILE --data FOLDER --chain CHAIN_CSV --emulator FILE --out FOLDER
                                   [--points N] [--batch N] [--burn-in N]

        Takes N points of the chain (after burn-in, evenly thinned) and computes the likelihood of each with the
        emulator and with the direct calculation (same grid spec, read from the emulator file), both in batches
        of the size the chain used (half the walkers), on all cores. Reports the distribution of |delta chi2|
        for -2 ln L with the linear nuisance parameters marginalised (what the chain samples) and for chi2 at
        their conditional best fit, and the wall-clock and CPU time per likelihood of each theory (timed
        batch by batch in turn, so that both see the same load from other programs).

        options:
          --points N    [200] chain points compared
          --batch N     [16] points per theory call (a 32-walker chain evaluates 16 proposals at a time)
          --burn-in N   [half the chain's steps] steps left out

        writes FOLDER/compare.csv (every point with both values) and FOLDER/compare.txt (the summary).
        """;

    /// <summary>Runs the command; returns the exit code.</summary>
    public static int Run(IReadOnlyList<string> args)
    {
        var options = new CommandOptions(args, ["--scenario", "--data", "--chain", "--emulator", "--out", "--points", "--batch", "--burn-in"], []);
        var scenario = SurveyScenario.Load(options.Required("--scenario"));
        string folder = options.Required("--out");
        Directory.CreateDirectory(folder);
        var data = DataVector.Read(Path.Combine(options.Required("--data"), "data.csv"), Path.Combine(options.Required("--data"), "covariance.csv"));
        string emulatorPath = options.Required("--emulator");
        var emulator = SpectrumEmulator.Load(emulatorPath);
        using var emulated = new EmulatorTheory(emulator, Path.GetFileName(emulatorPath), scenario.Redshift);
        var direct = new DirectTheory(emulator.Spec, scenario.Redshift);
        int wanted = options.Integer("--points", 200), batch = options.Integer("--batch", 16);
        string? burnText = options.Optional("--burn-in");
        var (names, samples) = ChainFile.Read(options.Required("--chain"), burnText is null ? null : int.Parse(burnText, CultureInfo.InvariantCulture));
        int count = Math.Min(wanted, samples.Count);
        double[][] points = [.. Enumerable.Range(0, count).Select(i => samples[(int)((long)i * samples.Count / count)])];

        var layout = emulator.Layout;
        var emulatorPosterior = new SurveyPosterior(emulated, new MultipoleLikelihood(data, layout, scenario), scenario, data.K);
        var directPosterior = new SurveyPosterior(direct, new MultipoleLikelihood(data, layout, scenario), scenario, data.K);
        if (!names.SequenceEqual(emulatorPosterior.Names))
        {
            throw new ArgumentException($"the chain's parameters ({string.Join(", ", names)}) differ from this scenario's ({string.Join(", ", emulatorPosterior.Names)})");
        }

        // Warm up both (JIT, thread pool, caches), then time them batch by batch in turn, so that both see the same load
        // on a machine shared with other work.
        emulatorPosterior.Likelihoods([points[0]]);
        directPosterior.Likelihoods([points[0]]);
        var fromEmulator = new List<LikelihoodValue>(count);
        var fromDirect = new List<LikelihoodValue>(count);
        TimeSpan emulatorTime = TimeSpan.Zero, directTime = TimeSpan.Zero, emulatorTheory = emulatorPosterior.TheoryTime, directTheory = directPosterior.TheoryTime;
        TimeSpan emulatorCpu = TimeSpan.Zero, directCpu = TimeSpan.Zero;
        using var process = Process.GetCurrentProcess();
        foreach (var chunk in points.Chunk(Math.Max(1, batch)))
        {
            long start = Stopwatch.GetTimestamp();
            var cpu = Cpu(process);
            fromEmulator.AddRange(emulatorPosterior.Likelihoods(chunk));
            emulatorTime += Stopwatch.GetElapsedTime(start);
            emulatorCpu += Cpu(process) - cpu;
            start = Stopwatch.GetTimestamp();
            cpu = Cpu(process);
            fromDirect.AddRange(directPosterior.Likelihoods(chunk));
            directTime += Stopwatch.GetElapsedTime(start);
            directCpu += Cpu(process) - cpu;
        }

        emulatorTheory = emulatorPosterior.TheoryTime - emulatorTheory;
        directTheory = directPosterior.TheoryTime - directTheory;
        double[] marginal = [.. fromEmulator.Zip(fromDirect, (e, d) => Math.Abs(e.MinusTwoLnL - d.MinusTwoLnL))];
        double[] bestFit = [.. fromEmulator.Zip(fromDirect, (e, d) => Math.Abs(e.Chi2 - d.Chi2))];
        WriteTable(Path.Combine(folder, "compare.csv"), names, points, [.. fromEmulator], [.. fromDirect]);
        double emulatorMs = emulatorTime.TotalMilliseconds / count, directMs = directTime.TotalMilliseconds / count;
        var c = CultureInfo.InvariantCulture;
        var text = new StringBuilder();
        text.AppendLine(c, $"# INVENTED survey '{scenario.Name}': emulator ({emulator.TrainingCount} training points) vs direct calculation at {count} chain points");
        text.AppendLine(Line("|delta(-2 ln L)|, linear nuisance marginalised", marginal));
        text.AppendLine(Line("|delta chi2| at the conditional best fit     ", bestFit));
        text.AppendLine(c, $"fraction of points with |delta(-2 ln L)| < 0.1: {marginal.Count(v => v < 0.1) / (double)count:P1} (DESIGN target: 99 %)");
        text.AppendLine(c, $"wall clock per likelihood, batches of {batch} on {Environment.ProcessorCount} cores, interleaved: emulator {emulatorMs:F4} ms ({emulatorTheory.TotalMilliseconds / count:F4} ms in the theory), direct {directMs:F3} ms ({directTheory.TotalMilliseconds / count:F3} ms in the theory)");
        text.AppendLine(c, $"CPU time per likelihood (all threads; insensitive to other programs' load): emulator {emulatorCpu.TotalMilliseconds / count:F4} ms, direct {directCpu.TotalMilliseconds / count:F3} ms, ratio {directCpu / emulatorCpu:F1}");
        text.AppendLine(c, $"speed-up of a chain on the emulator over the same chain on the direct calculation: {directMs / emulatorMs:F1}x (theory alone: {directTheory / emulatorTheory:F1}x)");
        File.WriteAllText(Path.Combine(folder, "compare.txt"), text.ToString());
        Console.Write(text.ToString());
        return 0;
    }

    private static TimeSpan Cpu(Process process)
    {
        process.Refresh();
        return process.TotalProcessorTime;
    }

    private static string Line(string what, double[] values)
    {
        double[] sorted = [.. values.Order()];
        return string.Create(
            CultureInfo.InvariantCulture,
            $"{what}: median {PosteriorSummary.Percentile(sorted, 0.5):G3}, 90th {PosteriorSummary.Percentile(sorted, 0.9):G3}, 99th {PosteriorSummary.Percentile(sorted, 0.99):G3}, max {sorted[^1]:G3}");
    }

    private static void WriteTable(string path, IReadOnlyList<string> names, double[][] points, LikelihoodValue[] emulator, LikelihoodValue[] direct)
    {
        var text = new StringBuilder();
        text.Append(string.Join(',', names)).AppendLine(",m2lnL_emulator,m2lnL_direct,chi2_emulator,chi2_direct");
        for (int i = 0; i < points.Length; i++)
        {
            double[] row = [.. points[i], emulator[i].MinusTwoLnL, direct[i].MinusTwoLnL, emulator[i].Chi2, direct[i].Chi2];
            text.AppendLine(string.Join(',', row.Select(v => v.ToString("R", CultureInfo.InvariantCulture))));
        }

        File.WriteAllText(path, text.ToString());
    }
}
