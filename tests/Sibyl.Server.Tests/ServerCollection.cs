namespace Sibyl.Server.Tests;

/// <summary>Every test that talks to the server shares one trained fixture and one running server.</summary>
[CollectionDefinition(Name)]
public sealed class ServerCollection : ICollectionFixture<ServerFixture>
{
    public const string Name = "server";
}
