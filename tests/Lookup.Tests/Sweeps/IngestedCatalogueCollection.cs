namespace Lookup.Tests.Sweeps;

/// <summary>The sweep command tests share one <see cref="IngestedCatalogue"/> (one real ingest per test run).</summary>
[CollectionDefinition(Name)]
public sealed class IngestedCatalogueCollection : ICollectionFixture<IngestedCatalogue>
{
    public const string Name = "Ingested catalogue with planted copies";
}
