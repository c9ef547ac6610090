using Sibyl.Training.Runs;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Tests.Runs;

[Collection(ReferenceRunCollection.Name)]
public class ShardedRunTests(ReferenceRun reference)
{
    [Fact]
    public void The_reference_run_computes_every_point_of_every_chunk()
    {
        Assert.Equal(6, reference.Summary.ChunksOwned);
        Assert.Equal(0, reference.Summary.ChunksReused);
        Assert.Equal(12, reference.Summary.PointsComputed);
        Assert.Empty(reference.Summary.Failures);
        Assert.Equal(6, Directory.GetFiles(reference.Folder, ChunkFile.Pattern).Length);
    }

    [Fact]
    public void Three_shards_in_one_folder_merge_to_the_unsharded_training_set_byte_for_byte()
    {
        using var folder = new TemporaryFolder();
        string run = folder.Folder("sharded.run");
        int owned = 0;
        for (int shard = 0; shard < 3; shard++)
        {
            owned += Run(run, new ShardSelection(shard, 3)).ChunksOwned;
        }

        Assert.Equal(reference.Design.ChunkCount, owned);
        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, [run]).ToBytes());
    }

    [Fact]
    public void Three_shards_in_three_folders_merge_to_the_unsharded_training_set_byte_for_byte()
    {
        using var folder = new TemporaryFolder();
        var runs = Enumerable.Range(0, 3).Select(s => folder.Folder($"shard-{s}.run")).ToArray();
        for (int shard = 0; shard < 3; shard++)
        {
            Run(runs[shard], new ShardSelection(shard, 3));

            // Shard I of N owns chunks c with c mod N = I: here two chunks each.
            Assert.Equal(
                Enumerable.Range(0, 6).Where(c => c % 3 == shard).Select(c => ChunkFile.PathOf(runs[shard], c)),
                Directory.GetFiles(runs[shard], ChunkFile.Pattern).Order(StringComparer.Ordinal));
        }

        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, runs).ToBytes());
    }

    [Fact]
    public void A_chunk_present_in_two_folders_with_the_same_results_merges()
    {
        using var folder = new TemporaryFolder();
        string copy = reference.CopyTo(folder, "copy.run");

        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, [reference.Folder, copy]).ToBytes());
    }

    [Fact]
    public void A_second_run_computes_nothing_new()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "again.run");
        var before = Directory.GetFiles(run).ToDictionary(f => f, File.GetLastWriteTimeUtc);

        var summary = Run(run, ShardSelection.All);

        Assert.Equal(summary.ChunksOwned, summary.ChunksReused);
        Assert.Equal(0, summary.PointsComputed);
        Assert.Equal(before, Directory.GetFiles(run).ToDictionary(f => f, File.GetLastWriteTimeUtc));
    }

    [Fact]
    public void A_deleted_chunk_is_computed_again_and_the_merge_is_unchanged()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "deleted.run");
        File.Delete(ChunkFile.PathOf(run, 4));

        var summary = Run(run, ShardSelection.All);

        Assert.Equal(5, summary.ChunksReused);
        Assert.Equal(2, summary.PointsComputed);
        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, [run]).ToBytes());
    }

    [Fact]
    public void A_corrupted_chunk_is_refused_by_merge_and_computed_again_by_run()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "corrupted.run");
        string chunk = ChunkFile.PathOf(run, 2);
        var bytes = File.ReadAllBytes(chunk);
        bytes[^5] ^= 0x40;
        File.WriteAllBytes(chunk, bytes);

        var refused = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run]));
        var notices = new List<string>();
        var summary = new TrainingRun(reference.Design, run, ShardSelection.All, 1, false).Execute(null, notices.Add, CancellationToken.None);

        Assert.Contains(refused.Problems, p => p.StartsWith($"{chunk}: corrupted", StringComparison.Ordinal) && p.EndsWith("(delete it and rerun its shard)", StringComparison.Ordinal));
        Assert.Equal($"{chunk}: corrupted: the data do not match the checksum in the header; computing it again", Assert.Single(notices));
        Assert.Equal(2, summary.PointsComputed);
        Assert.Equal(reference.Merged, TrainingSetMerger.Merge(reference.Design, [run]).ToBytes());
    }

    [Fact]
    public void Progress_counts_every_point_of_the_run()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "progress.run");
        File.Delete(ChunkFile.PathOf(run, 0));
        File.Delete(ChunkFile.PathOf(run, 5));
        var reports = new List<RunProgress>();

        // One thread, so reports arrive in order: 0 before the first point, then one per point.
        new TrainingRun(reference.Design, run, ShardSelection.All, 1, false).Execute(new ProgressRecorder(reports), null, CancellationToken.None);

        Assert.Equal(Enumerable.Range(0, 5), reports.Select(r => r.Done));
        Assert.All(reports, r => Assert.Equal(4, r.Total));
    }

    private RunSummary Run(string folder, ShardSelection shard) =>
        new TrainingRun(reference.Design, folder, shard, threads: 2, retryFailed: false).Execute(null, null, CancellationToken.None);}
