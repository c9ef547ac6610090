using System.Buffers.Binary;
using System.Text;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;
using Sibyl.Training.Storage;
using Sibyl.Training.Tests.Design;
using Sibyl.Training.Tests.Runs;

namespace Sibyl.Training.Tests.Storage;

[Collection(ReferenceRunCollection.Name)]
public class SealedFileTests(ReferenceRun reference)
{
    [Theory]
    [InlineData(8, "truncated: 8 bytes, shorter than the 56-byte header")]
    [InlineData(20, "truncated: 20 bytes, shorter than the 56-byte header")]
    [InlineData(55, "truncated: 55 bytes, shorter than the 56-byte header")]
    [InlineData(56, "truncated: the header promises")]
    [InlineData(100, "truncated: the header promises")]
    [InlineData(-1, "truncated: the header promises")]
    public void A_truncated_design_is_refused_as_truncated(int length, string message)
    {
        using var folder = new TemporaryFolder();
        string path = folder.File("grid.design");
        reference.Design.Save(path);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(length >= 0 ? length : bytes.Length + length)]);

        var e = Assert.Throws<CorruptFileException>(() => TrainingDesign.Load(path));

        Assert.StartsWith($"{path}: {message}", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(17)]
    [InlineData(-1)]
    public void One_flipped_payload_byte_is_refused_as_corrupted(int offset)
    {
        using var folder = new TemporaryFolder();
        string path = folder.File("grid.design");
        reference.Design.Save(path);
        var bytes = File.ReadAllBytes(path);
        bytes[offset >= 0 ? SealedFile.HeaderLength + offset : bytes.Length + offset] ^= 0x01;
        File.WriteAllBytes(path, bytes);

        var e = Assert.Throws<CorruptFileException>(() => TrainingDesign.Load(path));

        Assert.Equal($"{path}: corrupted: the data do not match the checksum in the header", e.Message);
    }

    [Fact]
    public void Foreign_files_are_refused_as_not_sibyl_files()
    {
        using var folder = new TemporaryFolder();
        var random = new SeededRandom(3);
        string binary = folder.File("random.bin"), text = folder.File("notes.txt"), empty = folder.File("empty");
        File.WriteAllBytes(binary, [.. Enumerable.Range(0, 300).Select(_ => (byte)random.NextInt(256))]);
        File.WriteAllText(text, "k P\n0.1 2000\n", Encoding.UTF8);
        File.WriteAllBytes(empty, []);

        foreach (string path in new[] { binary, text, empty })
        {
            var e = Assert.Throws<CorruptFileException>(() => TrainingDesign.Load(path));
            Assert.StartsWith($"{path}: not a Sibyl file", e.Message, StringComparison.Ordinal);
            Assert.Equal(path, e.Path);
        }
    }

    [Fact]
    public void A_file_of_another_kind_is_refused_naming_both_kinds()
    {
        using var folder = new TemporaryFolder();
        string chunk = ChunkFile.PathOf(reference.Folder, 0);
        string design = folder.File("grid.design");
        reference.Design.Save(design);

        var asDesign = Assert.Throws<CorruptFileException>(() => TrainingDesign.Load(chunk));
        var asTrainingSet = Assert.Throws<CorruptFileException>(() => TrainingSet.Load(design));

        Assert.Equal($"{chunk}: is a chunk of a training run, not a design", asDesign.Message);
        Assert.Equal($"{design}: is a design, not a training set", asTrainingSet.Message);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(0)]
    [InlineData(int.MaxValue)]
    public void A_file_of_an_unknown_format_version_is_refused_naming_the_version(int version)
    {
        using var folder = new TemporaryFolder();
        string path = folder.File("grid.design");
        reference.Design.Save(path);
        var bytes = File.ReadAllBytes(path);
        BinaryPrimitives.WriteInt32LittleEndian(bytes.AsSpan(12, 4), version);
        File.WriteAllBytes(path, bytes);

        var e = Assert.Throws<CorruptFileException>(() => TrainingDesign.Load(path));

        Assert.StartsWith($"{path}: format version {version}; this build of Sibyl reads a design versions 1 to 1", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_design_survives_save_and_load_bit_for_bit()
    {
        using var folder = new TemporaryFolder();
        string first = folder.File("a.design"), second = folder.File("b.design");
        reference.Design.Save(first);

        var loaded = TrainingDesign.Load(first);
        loaded.Save(second);

        Assert.Equal(File.ReadAllBytes(first), File.ReadAllBytes(second));
        Assert.Equal(reference.Design.Hash, loaded.Hash);
        Assert.Equal(GridSpecJson.Write(reference.Spec), GridSpecJson.Write(loaded.Spec));
        Assert.Equal(Strata.Block(reference.Design, 0, reference.Design.Count), Strata.Block(loaded, 0, loaded.Count));
        Assert.Equal(reference.Design.CriterionAfter, loaded.CriterionAfter);
        Assert.Equal(reference.Design.MinimumDistance, loaded.MinimumDistance);
    }

    [Fact]
    public void A_training_set_survives_save_and_load_bit_for_bit()
    {
        using var folder = new TemporaryFolder();
        string path = folder.File("grid.training");
        var set = TrainingSetMerger.Merge(reference.Design, [reference.Folder]);
        set.Save(path);

        var loaded = TrainingSet.Load(path);

        Assert.Equal(reference.Merged, File.ReadAllBytes(path));
        Assert.Equal(reference.Merged, loaded.ToBytes());
        Assert.Equal(reference.Design.Hash, loaded.DesignHash);
        Assert.Equal(CodeFingerprint.Current, loaded.CodeFingerprint);
        Assert.Equal(set.Spectra(3, 0).Term(1).ToArray(), loaded.Spectra(3, 0).Term(1).ToArray());
        Assert.Equal(reference.Design.Point(3), loaded.Parameters(3));
    }
}
