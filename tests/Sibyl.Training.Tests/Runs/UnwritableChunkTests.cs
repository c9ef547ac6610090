using Sibyl.Training.Runs;
using Sibyl.Training.Storage;

namespace Sibyl.Training.Tests.Runs;

[Collection(ReferenceRunCollection.Name)]
public class UnwritableChunkTests(ReferenceRun reference)
{
    [Fact]
    public void A_chunk_that_cannot_be_written_stops_the_run_with_an_io_error_and_keeps_the_others()
    {
        // A folder where chunk 3's file should go makes its atomic rename fail, as a full disk or a lost mount would.
        using var folder = new TemporaryFolder();
        string run = Path.Combine(folder.Path, "blocked.run");
        Directory.CreateDirectory(ChunkFile.PathOf(run, 3));
        Assert.ThrowsAny<IOException>(() => new TrainingRun(reference.Design, run, ShardSelection.All, 2, false).Execute(null, null, CancellationToken.None));
        Assert.All(Directory.GetFiles(run, ChunkFile.Pattern), path => ChunkFile.Read(path, reference.Design, TrainingOutput.ValuesPerPoint(reference.Design.Spec)));

        // Workers take chunks in order, one at a time, and the run lets chunks in flight finish: chunks 0-2 were taken
        // before chunk 3 and so are stored whatever the timing (4 and 5 may or may not be). Without this the check
        // above would pass on an empty folder.
        Assert.All([0, 1, 2], chunk => Assert.True(File.Exists(ChunkFile.PathOf(run, chunk)), $"chunk {chunk} is missing"));
        Assert.False(File.Exists(ChunkFile.PathOf(run, 3)));
    }
}
