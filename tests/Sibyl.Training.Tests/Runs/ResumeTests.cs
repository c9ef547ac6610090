using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Storage;
using Sibyl.Training.Tests.Linear;

namespace Sibyl.Training.Tests.Runs;

[Collection(ReferenceRunCollection.Name)]
public class ResumeTests(ReferenceRun reference)
{
    [Fact]
    public void A_cancelled_run_keeps_its_finished_chunks_and_resumes_to_the_same_training_set()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "cancelled.run");
        for (int chunk = 2; chunk < 6; chunk++)
        {
            File.Delete(ChunkFile.PathOf(run, chunk));
        }

        // One thread: cancel after the first point of chunk 2, so chunk 2 is abandoned half-way.
        using var cancel = new CancellationTokenSource();
        var progress = new ProgressRecorder([], p =>
        {
            if (p.Done == 1)
            {
                cancel.Cancel();
            }
        });
        Assert.ThrowsAny<OperationCanceledException>(() => new TrainingRun(reference.Design, run, ShardSelection.All, 1, false).Execute(progress, null, cancel.Token));

        Assert.Equal([ChunkFile.PathOf(run, 0), ChunkFile.PathOf(run, 1)], Directory.GetFiles(run).Order(StringComparer.Ordinal));
        var summary = new TrainingRun(reference.Design, run, ShardSelection.All, 2, false).Execute(null, null, CancellationToken.None);
        Assert.Equal(2, summary.ChunksReused);
        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, [run]).ToBytes());
    }

    [Fact]
    public void Failed_points_are_kept_on_resume_and_computed_again_on_request()
    {
        // A linear program that fails on its first call only: point 0 fails, point 1 (a chunk of its own) succeeds.
        using var folder = new TemporaryFolder();
        string table = folder.File("linear.txt"), mark = folder.File("called-before");
        ProviderSpec.WriteTable(table);
        var design = TrainingDesign.Create(ProviderSpec.With(
            ["sh", "-c", $"cat > /dev/null; if [ -e '{mark}' ]; then cat '{table}'; else touch '{mark}'; echo 'first call fails' >&2; exit 1; fi"], 30));
        string run = folder.Folder("retry.run");

        var first = Execute(design, run, retryFailed: false);
        var resumed = Execute(design, run, retryFailed: false);
        var retried = Execute(design, run, retryFailed: true);

        Assert.Equal("linear program 'sh' exited with code 1: first call fails", Assert.Single(first.Failures).Error);
        Assert.Equal(0, resumed.PointsComputed);
        Assert.Equal(0, Assert.Single(resumed.Failures).Index);
        Assert.Equal(1, retried.PointsComputed);
        Assert.Equal(1, retried.ChunksReused);
        Assert.Empty(retried.Failures);
        Assert.Null(TrainingSetMerger.Merge(design, [run]).Error(0));
    }

    private static RunSummary Execute(TrainingDesign design, string folder, bool retryFailed) =>
        new TrainingRun(design, folder, ShardSelection.All, threads: 1, retryFailed).Execute(null, null, CancellationToken.None);
}
