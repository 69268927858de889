namespace Lookup.Tests.Embedding;

/// <summary>Test classes in this collection share one <see cref="EmbedderFixture"/> and run one after another.</summary>
[CollectionDefinition(Name)]
public sealed class EmbedderCollection : ICollectionFixture<EmbedderFixture>
{
    public const string Name = "Real ResNet18 embedder";
}
