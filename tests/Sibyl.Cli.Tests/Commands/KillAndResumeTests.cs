using System.Diagnostics;
using System.Text;
using System.Text.RegularExpressions;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Storage;

namespace Sibyl.Cli.Tests.Commands;

public partial class KillAndResumeTests
{
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(90);

    [Fact]
    public void A_killed_run_resumes_to_the_training_set_of_an_uninterrupted_run()
    {
        // 36 + 4 points in chunks of 2 on one thread: 20 chunks written one after another, so a kill soon after
        // the first chunk appears lands with most of them still to do.
        using var folder = new TrainingFolder(training: 36, heldOut: 4, chunkSize: 2);
        folder.Plan();
        var design = TrainingDesign.Load(folder.Design);
        string killed = folder.File("killed.run"), whole = folder.File("whole.run");

        int stored = KillAfterFirstChunk(folder.Design, killed);

        Assert.InRange(stored, 1, design.ChunkCount - 1);
        foreach (string file in Directory.GetFiles(killed))
        {
            string name = Path.GetFileName(file);
            if (name.StartsWith('.'))
            {
                Assert.Matches(TemporaryChunk(), name);
            }
            else
            {
                // Written atomically: every chunk file present is complete and checks out.
                ChunkFile.Read(file, design, TrainingOutput.ValuesPerPoint(design.Spec));
            }
        }

        var resumed = CliRun.Of("run", folder.Design, "--out", killed, "--threads", "2");
        var uninterrupted = CliRun.Of("run", folder.Design, "--out", whole, "--threads", "2");
        Assert.Equal(0, resumed.ExitCode);
        Assert.Contains($"{stored} already stored, {design.Count - (2 * stored)} points computed", resumed.Stderr, StringComparison.Ordinal);
        Assert.Equal(0, uninterrupted.ExitCode);
        Assert.Equal(0, CliRun.Of("merge", folder.Design, killed, "--out", folder.File("killed.training")).ExitCode);
        Assert.Equal(0, CliRun.Of("merge", folder.Design, whole, "--out", folder.File("whole.training")).ExitCode);
        Assert.Equal(File.ReadAllBytes(folder.File("whole.training")), File.ReadAllBytes(folder.File("killed.training")));
    }

    /// <summary>Starts <c>sibyl run</c> as a child process, kills it once a chunk is stored, and returns how many are.</summary>
    private static int KillAfterFirstChunk(string design, string runFolder)
    {
        string sibyl = Path.Combine(AppContext.BaseDirectory, "sibyl.dll");
        string dotnet = Environment.ProcessPath is { } host && Path.GetFileNameWithoutExtension(host) == "dotnet" ? host : "dotnet";
        var start = new ProcessStartInfo(dotnet) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string argument in new[] { sibyl, "run", design, "--out", runFolder, "--threads", "1" })
        {
            start.ArgumentList.Add(argument);
        }

        var log = new StringBuilder();
        using var process = new Process { StartInfo = start };
        process.ErrorDataReceived += (_, e) => { lock (log) { log.AppendLine(e.Data); } };
        process.OutputDataReceived += (_, e) => { lock (log) { log.AppendLine(e.Data); } };
        process.Start();
        process.BeginErrorReadLine();
        process.BeginOutputReadLine();
        var clock = Stopwatch.StartNew();
        try
        {
            while (!Directory.Exists(runFolder) || Directory.GetFiles(runFolder, ChunkFile.Pattern).Length == 0)
            {
                Assert.False(process.HasExited, $"sibyl run exited with code {(process.HasExited ? process.ExitCode : 0)} before storing a chunk: {log}");
                Assert.True(clock.Elapsed < Limit, $"no chunk after {Limit}: {log}");
                Thread.Sleep(5);
            }
        }
        finally
        {
            process.Kill(entireProcessTree: true);
            Assert.True(process.WaitForExit(Limit), "the killed process did not end");
        }

        return Directory.GetFiles(runFolder, ChunkFile.Pattern).Length;
    }

    // AtomicFile's temporaries: hidden, named after the target, a GUID and .tmp.
    [GeneratedRegex(@"^\.chunk-\d{6}\.sibyl\.[0-9a-f]{32}\.tmp$")]
    private static partial Regex TemporaryChunk();
}
