using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Tests.Runs;

[Collection(ReferenceRunCollection.Name)]
public class MergeRefusalTests(ReferenceRun reference)
{
    [Fact]
    public void Missing_chunks_are_named_with_their_points_and_the_shard_to_rerun()
    {
        using var folder = new TemporaryFolder();
        string run = folder.Folder("shards.run");
        Run(reference.Design, run, new ShardSelection(0, 3));
        Run(reference.Design, run, new ShardSelection(2, 3));

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run]));

        // Shard 1/3 owns chunks 1 and 4, points 2-3 and 8-9 with chunks of 2.
        Assert.Equal(
            ["2 of 6 chunks (4 points) are missing: 1 (points 2-3), 4 (points 8-9)",
             "they belong to shard 1/3: rerun just those (`sibyl run DESIGN --shard I/3`)"],
            e.Problems);
    }

    [Fact]
    public void An_empty_folder_is_refused_with_a_hint_to_run_first()
    {
        using var folder = new TemporaryFolder();
        string run = folder.Folder("empty.run");

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run, folder.File("absent.run")]));

        Assert.Contains($"{folder.File("absent.run")}: no such run folder", e.Problems);
        Assert.Contains(e.Problems, p => p.StartsWith("no chunks of this design in", StringComparison.Ordinal));
    }

    [Fact]
    public void A_chunk_of_another_design_is_refused()
    {
        using var folder = new TemporaryFolder();
        var other = TrainingDesign.Create(reference.Spec with { Seed = reference.Spec.Seed + 1 });
        string otherRun = folder.Folder("other.run");
        Run(other, otherRun, new ShardSelection(0, 6));
        string run = reference.CopyTo(folder, "mixed.run");
        File.Copy(ChunkFile.PathOf(otherRun, 0), ChunkFile.PathOf(run, 0), overwrite: true);

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run]));

        Assert.Contains(e.Problems, p => p.StartsWith($"{ChunkFile.PathOf(run, 0)}: belongs to another design", StringComparison.Ordinal));
    }

    [Fact]
    public void A_chunk_present_twice_with_different_results_is_refused()
    {
        using var folder = new TemporaryFolder();
        string second = folder.Folder("second.run");
        var chunk = ChunkFile.Read(ChunkFile.PathOf(reference.Folder, 3), reference.Design, TrainingOutput.ValuesPerPoint(reference.Spec));
        chunk.Values[1]![5] *= 1.0 + 1e-12;
        ChunkFile.Write(second, chunk);

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [reference.Folder, second]));

        Assert.Equal($"chunk 3 differs between {ChunkFile.PathOf(reference.Folder, 3)} and {ChunkFile.PathOf(second, 3)}; keep one of them", Assert.Single(e.Problems));
    }

    [Fact]
    public void A_chunk_present_twice_with_different_errors_is_refused()
    {
        using var folder = new TemporaryFolder();
        string second = folder.Folder("second.run");
        var chunk = ChunkFile.Read(ChunkFile.PathOf(reference.Folder, 1), reference.Design, TrainingOutput.ValuesPerPoint(reference.Spec));
        chunk.Values[0] = null;
        chunk.Errors[0] = "linear program 'x' timed out after 1 s and was killed";
        ChunkFile.Write(second, chunk);

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [second, reference.Folder]));

        Assert.Contains(e.Problems, p => p.StartsWith("chunk 1 differs between", StringComparison.Ordinal));
    }

    [Fact]
    public void Chunks_of_another_build_are_refused_by_merge_and_by_run()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "builds.run");
        string path = ChunkFile.PathOf(run, 5);
        var chunk = ChunkFile.Read(path, reference.Design, TrainingOutput.ValuesPerPoint(reference.Spec));
        chunk.CodeFingerprint = "0000000000000000";
        ChunkFile.Write(run, chunk);

        var merge = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run]));
        var resume = Assert.Throws<RunConflictException>(() => Run(reference.Design, run, ShardSelection.All));

        var problem = Assert.Single(merge.Problems);
        Assert.StartsWith("the chunks come from different builds of Sibyl: ", problem, StringComparison.Ordinal);
        Assert.Contains($"0000000000000000 (1 chunks, e.g. {path})", problem, StringComparison.Ordinal);
        Assert.Contains($"{CodeFingerprint.Current} (5 chunks", problem, StringComparison.Ordinal);
        Assert.StartsWith($"{path} was computed by another build of Sibyl (code fingerprint 0000000000000000, this build {CodeFingerprint.Current})", resume.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_chunk_renamed_to_another_chunk_is_refused()
    {
        using var folder = new TemporaryFolder();
        string run = reference.CopyTo(folder, "renamed.run");
        File.Copy(ChunkFile.PathOf(run, 1), ChunkFile.PathOf(run, 2), overwrite: true);

        var e = Assert.Throws<MergeException>(() => TrainingSetMerger.Merge(reference.Design, [run]));

        Assert.Contains(e.Problems, p => p.StartsWith($"{ChunkFile.PathOf(run, 2)}: holds chunk 1, which does not match its file name", StringComparison.Ordinal));
    }

    private static RunSummary Run(TrainingDesign design, string folder, ShardSelection shard) =>
        new TrainingRun(design, folder, shard, threads: 2, retryFailed: false).Execute(null, null, CancellationToken.None);
}
