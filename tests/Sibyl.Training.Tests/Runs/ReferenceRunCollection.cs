namespace Sibyl.Training.Tests.Runs;

/// <summary>Test classes that share one <see cref="ReferenceRun"/>.</summary>
[CollectionDefinition(Name)]
public sealed class ReferenceRunCollection : ICollectionFixture<ReferenceRun>
{
    public const string Name = "reference run";
}
