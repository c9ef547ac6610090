using Sibyl.Training.Design;

namespace Sibyl.Cli.Tests.Commands;

public class PlanRunMergeTests
{
    [Fact]
    public void Plan_writes_the_design_and_prints_its_path()
    {
        using var folder = new TrainingFolder();

        var run = CliRun.Of("plan", folder.Spec, "--out", folder.Design);

        Assert.Equal(0, run.ExitCode);
        Assert.Equal(folder.Design + Environment.NewLine, run.Stdout);
        Assert.StartsWith("plan: 4 training + 2 held-out points over omega_cdm, h; 3 chunks of 2; maximin phi_20 ", run.Stderr, StringComparison.Ordinal);
        Assert.Equal(6, TrainingDesign.Load(folder.Design).Count);
    }

    [Fact]
    public void Plan_lists_every_problem_of_a_bad_spec_on_stderr()
    {
        using var folder = new TrainingFolder(training: 1, extra: ", \"colour\": \"red\", \"linear\": {\"command\": []}");

        var run = CliRun.Of("plan", folder.Spec, "--out", folder.Design);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith($"sibyl: {folder.Spec}: 3 problems:", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("colour: unknown field", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("points.training: must be an integer in [2, 1000000], got 1", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("linear.command: must be a non-empty array", run.Stderr, StringComparison.Ordinal);
        Assert.Empty(run.Stdout);
        Assert.False(File.Exists(folder.Design));
    }

    [Fact]
    public void Plan_refuses_a_missing_spec_file()
    {
        using var folder = new TrainingFolder();

        var run = CliRun.Of("plan", folder.File("absent.json"));

        Assert.Equal(2, run.ExitCode);
        Assert.Equal($"sibyl: plan: spec file '{folder.File("absent.json")}' not found", run.Stderr.TrimEnd());
    }

    [Theory]
    [InlineData("3/3")]
    [InlineData("x/2")]
    [InlineData("1/0")]
    [InlineData("-1/2")]
    [InlineData("1/2/3")]
    [InlineData("1")]
    public void Run_refuses_a_bad_shard_naming_the_option(string shard)
    {
        using var folder = new TrainingFolder();
        folder.Plan();

        var run = CliRun.Of("run", folder.Design, "--shard", shard);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith($"sibyl: --shard: '{shard}' must be I/N with N >= 1 and 0 <= I < N", run.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(folder.File("grid.run")));
    }

    [Fact]
    public void Merge_names_the_shard_to_rerun_and_succeeds_once_it_has_run()
    {
        using var folder = new TrainingFolder();
        folder.Plan();
        string training = folder.File("grid.training");

        var first = CliRun.Of("run", folder.Design, "--shard", "0/2", "--threads", "1");
        var refused = CliRun.Of("merge", folder.Design);

        Assert.Equal(0, first.ExitCode);
        Assert.Equal(2, refused.ExitCode);

        // Six points in chunks of 2: chunks 0 and 2 belong to shard 0/2, chunk 1 (points 2-3) to shard 1/2.
        Assert.Contains("1 of 3 chunks (2 points) are missing: 1 (points 2-3)", refused.Stderr, StringComparison.Ordinal);
        Assert.Contains("they belong to shard 1/2", refused.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(training));

        var second = CliRun.Of("run", folder.Design, "--shard", "1/2", "--threads", "1");
        var merged = CliRun.Of("merge", folder.Design);

        Assert.Equal(0, second.ExitCode);
        Assert.Contains("run: shard 1/2: 1 chunks, 0 already stored, 2 points computed", second.Stderr, StringComparison.Ordinal);
        Assert.Equal(0, merged.ExitCode);
        Assert.Equal(training + Environment.NewLine, merged.Stdout);
        Assert.Equal(6, Sibyl.Training.TrainingSet.Load(training).Count);
    }

    [Theory]
    [InlineData("plan")]
    [InlineData("run")]
    [InlineData("merge")]
    public void Help_of_each_training_command_exits_zero(string command)
    {
        var run = CliRun.Of(command, "--help");

        Assert.Equal(0, run.ExitCode);
        Assert.StartsWith($"usage: sibyl {command} ", run.Stdout, StringComparison.Ordinal);
        Assert.Contains("--out", run.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("run")]
    [InlineData("merge")]
    public void A_missing_design_file_is_a_usage_error(string command)
    {
        using var folder = new TrainingFolder();

        var run = CliRun.Of(command, folder.Design);

        Assert.Equal(2, run.ExitCode);
        Assert.Equal($"sibyl: design file '{folder.Design}' not found (make one with sibyl plan SPEC)", run.Stderr.TrimEnd());
    }

    [Fact]
    public void A_file_that_is_not_a_design_is_refused_naming_it()
    {
        using var folder = new TrainingFolder();

        var run = CliRun.Of("run", folder.Spec);

        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith($"sibyl: {folder.Spec}: not a Sibyl file", run.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Failed_points_give_exit_code_3_and_are_listed_then_kept_by_merge()
    {
        // A linear program that outlives its 1 s limit fails every point; both chunks run at once.
        using var folder = new TrainingFolder(
            training: 2,
            heldOut: 0,
            chunkSize: 1,
            extra: ", \"linear\": {\"command\": [\"sh\", \"-c\", \"sleep 5\"], \"timeout_seconds\": 1}");
        folder.Plan();

        var run = CliRun.Of("run", folder.Design, "--threads", "2");
        var merge = CliRun.Of("merge", folder.Design);

        Assert.Equal(3, run.ExitCode);
        Assert.Contains("run: point 0 failed (omega_cdm=", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("linear program 'sh' timed out after 1 s and was killed", run.Stderr, StringComparison.Ordinal);
        Assert.Contains("run: 2 point(s) failed and are recorded as such; `sibyl run ... --retry-failed` computes them again", run.Stderr, StringComparison.Ordinal);
        Assert.Equal(0, merge.ExitCode);
        Assert.Contains("merge: warning: 2 failed point(s) will be left out of any fit", merge.Stderr, StringComparison.Ordinal);
    }
}
