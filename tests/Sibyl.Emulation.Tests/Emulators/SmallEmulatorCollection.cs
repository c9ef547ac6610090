namespace Sibyl.Emulation.Tests.Emulators;

/// <summary>Shares one <see cref="SmallEmulatorFixture"/> between the emulator test classes.</summary>
[CollectionDefinition(Name)]
public sealed class SmallEmulatorCollection : ICollectionFixture<SmallEmulatorFixture>
{
    public const string Name = "small emulator";
}
