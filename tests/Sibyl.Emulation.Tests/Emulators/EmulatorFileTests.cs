using Sibyl.Emulation.Emulators;
using Sibyl.Training.Storage;

namespace Sibyl.Emulation.Tests.Emulators;

[Collection(SmallEmulatorCollection.Name)]
public sealed class EmulatorFileTests(SmallEmulatorFixture fixture)
{
    [Fact]
    public void Save_and_load_round_trip_is_bit_exact_in_file_and_predictions()
    {
        byte[] bytes = fixture.Emulator.ToBytes();
        var loaded = SpectrumEmulator.FromBytes(bytes, "round trip");
        Assert.Equal(bytes, loaded.ToBytes());
        int size = loaded.Layout.Terms.Count * loaded.K.Count, d = loaded.ParameterNames.Count;
        var before = (Values: new double[size], Variance: new double[size], Gradient: new double[size * d]);
        var after = (Values: new double[size], Variance: new double[size], Gradient: new double[size * d]);
        fixture.Emulator.CreatePredictor().Predict([0.117, 0.81], 1, before.Values, before.Variance, before.Gradient);
        loaded.CreatePredictor().Predict([0.117, 0.81], 1, after.Values, after.Variance, after.Gradient);
        Assert.Equal(before.Values, after.Values);
        Assert.Equal(before.Variance, after.Variance);
        Assert.Equal(before.Gradient, after.Gradient);
    }

    [Fact]
    public void Truncated_corrupted_foreign_and_newer_files_are_refused_clearly()
    {
        byte[] bytes = fixture.Emulator.ToBytes();
        Assert.Contains("truncated", Refuse(bytes[..(bytes.Length / 2)]), StringComparison.Ordinal);
        Assert.Contains("truncated", Refuse(bytes[..20]), StringComparison.Ordinal);

        byte[] flipped = (byte[])bytes.Clone();
        flipped[^100] ^= 0x10;
        Assert.Contains("corrupted", Refuse(flipped), StringComparison.Ordinal);

        Assert.Contains("not a Sibyl file", Refuse("k,P\n0.1,1000\n"u8.ToArray()), StringComparison.Ordinal);

        byte[] newer = (byte[])bytes.Clone();
        newer[12] = 2;
        Assert.Contains("format version 2", Refuse(newer), StringComparison.Ordinal);

        var training = fixture.Set.ToBytes();
        Assert.Contains("is a training set, not an emulator", Refuse(training), StringComparison.Ordinal);
    }

    private static string Refuse(byte[] bytes) =>
        Assert.Throws<CorruptFileException>(() => SpectrumEmulator.FromBytes(bytes, "emulator.bin")).Message;
}
