namespace Lookup.Tests.Cli;

/// <summary>Test classes in this collection share one <see cref="IngestedTemplate"/> and run one after another (each starts real processes).</summary>
[CollectionDefinition(Name)]
public sealed class IngestedTemplateCollection : ICollectionFixture<IngestedTemplate>
{
    public const string Name = "Reference photos ingested by the real CLI";
}
