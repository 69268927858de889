namespace Lookup.Tests.Cli;

/// <summary>Match command test classes share one ingested <see cref="MatchIndexFixture"/>.</summary>
[CollectionDefinition(Name)]
public sealed class MatchCollection : ICollectionFixture<MatchIndexFixture>
{
    public const string Name = "Match command on an ingested reference index";
}
