namespace Lookup.Tests.Calibration;

/// <summary>Test classes in this collection share one <see cref="ReferenceCatalogue"/> and run one after another.</summary>
[CollectionDefinition(Name)]
public sealed class ReferenceCatalogueCollection : ICollectionFixture<ReferenceCatalogue>
{
    public const string Name = "Reference catalogue, ingested and calibrated";
}
