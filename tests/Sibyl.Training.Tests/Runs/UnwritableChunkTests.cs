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
    }
}
