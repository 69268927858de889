namespace Lookup.Calibration;

/// <summary>
/// Photos as small integers: the SKU each belongs to and its content (equal SHA-256 = equal content; a photo
/// without a hash is content of its own). Pairs of equal content are byte copies, never strangers or siblings.
/// </summary>
internal sealed class PhotoGroups
{
    private PhotoGroups(int[] sku, int skuCount, int[] content)
    {
        Sku = sku;
        SkuCount = skuCount;
        Content = content;
    }

    /// <summary>SKU number of each photo, 0 … <see cref="SkuCount"/> − 1, in ordinal order of the SKU text.</summary>
    public int[] Sku { get; }

    /// <summary>Distinct SKUs.</summary>
    public int SkuCount { get; }

    /// <summary>Content number of each photo.</summary>
    public int[] Content { get; }

    /// <summary>Photos per SKU number.</summary>
    public int[] PhotosPerSku()
    {
        var counts = new int[SkuCount];
        foreach (int s in Sku)
        {
            counts[s]++;
        }

        return counts;
    }

    public static PhotoGroups Of(IReadOnlyList<string> skus, IReadOnlyList<string?> hashes)
    {
        var skuNumbers = skus.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal)
            .Select((sku, number) => (sku, number)).ToDictionary(p => p.sku, p => p.number, StringComparer.Ordinal);
        var contentNumbers = new Dictionary<string, int>(StringComparer.Ordinal);
        var sku = new int[skus.Count];
        var content = new int[skus.Count];
        for (int i = 0; i < sku.Length; i++)
        {
            sku[i] = skuNumbers[skus[i]];
            string key = hashes[i] ?? $"\0{i}";
            if (!contentNumbers.TryGetValue(key, out int number))
            {
                number = contentNumbers.Count;
                contentNumbers.Add(key, number);
            }

            content[i] = number;
        }

        return new PhotoGroups(sku, skuNumbers.Count, content);
    }
}
