namespace Lookup.Demo;

/// <summary>A field photo of the demo catalogue and the SKU it really shows.</summary>
/// <param name="File">Path relative to the demo folder, '/' separated (e.g. <c>field/bench-01.jpg</c>).</param>
/// <param name="Sku">The SKU the photo shows, or null for a part the supplier does not stock.</param>
/// <param name="Description">What the part is, in words.</param>
internal sealed record DemoFieldPhoto(string File, string? Sku, string Description);
